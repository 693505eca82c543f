/* Triggered-firmware harness on libsimavr (Debian libsimavr-dev 1.6): runs an
 * AVR image (Intel HEX as the bundle ships it), drives one input pin as a
 * square wave (a zero-cross detector's output toggles at each crossing; a
 * trigger source gives one edge per half period) and prints every input and
 * output pin change with its CPU cycle, one per line: "in <cycle> <0|1>",
 * "out <cycle> <0|1|z>". The output reads z while its DDR bit is 0.
 * The first input change comes at first_cycles, then every half_cycles.
 * usage: trigger-trace <mcu> <f_hz> <image.hex> <out port> <out bit>
 *        <in port> <in bit> <first_cycles> <half_cycles> <cycles>
 */
#include <stdio.h>
#include <stdlib.h>
#include "sim_avr.h"
#include "sim_hex.h"
#include "avr_ioport.h"

static avr_t *avr;
static int out_bit, ddr_on, level = -1;
static char last = '?';

static void emit(void)
{
  char v = !ddr_on ? 'z' : (level < 0 ? 'x' : (level ? '1' : '0'));
  if (v == last) return;
  last = v;
  printf("out %llu %c\n", (unsigned long long)avr->cycle, v);
}

static void on_pin(struct avr_irq_t *irq, uint32_t value, void *param)
{
  (void)irq; (void)param;
  level = value ? 1 : 0;
  emit();
}

static void on_ddr(struct avr_irq_t *irq, uint32_t value, void *param)
{
  (void)irq; (void)param;
  ddr_on = (value >> out_bit) & 1;
  emit();
}

int main(int argc, char **argv)
{
  if (argc != 11) {
    fprintf(stderr, "usage: trigger-trace <mcu> <f_hz> <image.hex> <out port> <out bit> <in port> <in bit> <first> <half> <cycles>\n");
    return 2;
  }
  avr = avr_make_mcu_by_name(argv[1]);
  if (!avr) { fprintf(stderr, "simavr has no core %s\n", argv[1]); return 3; }
  avr_init(avr);
  avr->frequency = strtoul(argv[2], NULL, 10);
  avr->log = 0;
  ihex_chunk_p chunks = NULL;
  int n = read_ihex_chunks(argv[3], &chunks);
  if (n <= 0) { fprintf(stderr, "cannot read %s\n", argv[3]); return 4; }
  for (int i = 0; i < n; i++)
    if (chunks[i].baseaddr < 0x800000) avr_loadcode(avr, chunks[i].data, chunks[i].size, chunks[i].baseaddr);
  avr->pc = 0;
  char oport = argv[4][0], iport = argv[6][0];
  out_bit = atoi(argv[5]);
  int in_bit = atoi(argv[7]);
  unsigned long long next = strtoull(argv[8], NULL, 10), half = strtoull(argv[9], NULL, 10);
  unsigned long long cycles = strtoull(argv[10], NULL, 10);
  avr_irq_t *pin = avr_io_getirq(avr, AVR_IOCTL_IOPORT_GETIRQ(oport), out_bit);
  avr_irq_t *dir = avr_io_getirq(avr, AVR_IOCTL_IOPORT_GETIRQ(oport), IOPORT_IRQ_DIRECTION_ALL);
  avr_irq_t *in = avr_io_getirq(avr, AVR_IOCTL_IOPORT_GETIRQ(iport), in_bit);
  if (!pin || !dir || !in) { fprintf(stderr, "no such port\n"); return 6; }
  avr_irq_register_notify(pin, on_pin, NULL);
  avr_irq_register_notify(dir, on_ddr, NULL);
  int in_level = 1; /* idle high, as with the pull-up */
  avr_raise_irq(in, in_level);
  emit();
  int state = cpu_Running;
  while (avr->cycle < cycles && state != cpu_Done && state != cpu_Crashed) {
    if (avr->cycle >= next) {
      in_level = !in_level;
      printf("in %llu %d\n", (unsigned long long)avr->cycle, in_level);
      avr_raise_irq(in, in_level);
      next += half;
    }
    state = avr_run(avr);
  }
  printf("end %llu %d\n", (unsigned long long)avr->cycle, state);
  return state == cpu_Crashed ? 7 : 0;
}
