/* Runs an AVR image (Intel HEX) in libsimavr (Debian libsimavr-dev 1.6) with
 * a switch on one input port, and writes one output pin to a VCD file
 * (IEEE 1364-2005 section 18), timescale 1 ps, time = cycle / f, like
 * pin-trace.c. The switch is a list of <cycle>:<mask> events: from that
 * cycle on, the input pins whose bit is set in mask are held low (a closed
 * contact to ground) and the others high (the pull-up's level), through the
 * port's pin IRQs; only the pins in <in bits> are driven (the switch's
 * contacts), so an output on the same port is left alone. Events must be in
 * cycle order.
 * usage: switch-trace <mcu> <f_hz> <image.hex> <out port> <out bit> <cycles> <out.vcd>
 *        <in port> <in bits> <cycle>:<mask> [<cycle>:<mask> ...]
 */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "sim_avr.h"
#include "sim_hex.h"
#include "avr_ioport.h"

static FILE *out;
static double ps_per_cycle;
static int bit, ddr_on, level = -1;
static char last = '?';
static avr_t *avr;

static void emit(void)
{
  char v = !ddr_on ? 'z' : (level < 0 ? 'x' : (level ? '1' : '0'));
  if (v == last) return;
  last = v;
  fprintf(out, "#%.0f\n%c!\n", (double)avr->cycle * ps_per_cycle, v);
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
  ddr_on = (value >> bit) & 1;
  emit();
}

static unsigned driven;

static void set_switch(char port, unsigned mask)
{
  for (int b = 0; b < 8; b++) {
    if (!((driven >> b) & 1)) continue;
    avr_irq_t *p = avr_io_getirq(avr, AVR_IOCTL_IOPORT_GETIRQ(port), b);
    if (p) avr_raise_irq(p, (mask >> b) & 1 ? 0 : 1);
  }
}

int main(int argc, char **argv)
{
  if (argc < 11) {
    fprintf(stderr, "usage: switch-trace <mcu> <f_hz> <image.hex> <port> <bit> <cycles> <out.vcd> <in port> <in bits> <cycle>:<mask>...\n");
    return 2;
  }
  const char *mcu = argv[1];
  unsigned long f = strtoul(argv[2], NULL, 10);
  char port = argv[4][0];
  bit = atoi(argv[5]);
  unsigned long long cycles = strtoull(argv[6], NULL, 10);
  char in_port = argv[8][0];
  driven = (unsigned)strtoul(argv[9], NULL, 0);
  int nev = argc - 10;
  unsigned long long *at = calloc((size_t)nev, sizeof *at);
  unsigned *mask = calloc((size_t)nev, sizeof *mask);
  for (int i = 0; i < nev; i++) {
    char *colon = strchr(argv[10 + i], ':');
    if (!colon) { fprintf(stderr, "bad event %s\n", argv[10 + i]); return 2; }
    at[i] = strtoull(argv[10 + i], NULL, 10);
    mask[i] = (unsigned)strtoul(colon + 1, NULL, 0);
  }
  avr = avr_make_mcu_by_name(mcu);
  if (!avr) { fprintf(stderr, "simavr has no core %s\n", mcu); return 3; }
  avr_init(avr);
  avr->frequency = f;
  avr->log = 0;
  ihex_chunk_p chunks = NULL;
  int n = read_ihex_chunks(argv[3], &chunks);
  if (n <= 0) { fprintf(stderr, "cannot read %s\n", argv[3]); return 4; }
  for (int i = 0; i < n; i++)
    if (chunks[i].baseaddr < 0x800000) avr_loadcode(avr, chunks[i].data, chunks[i].size, chunks[i].baseaddr);
  avr->pc = 0;
  out = fopen(argv[7], "w");
  if (!out) { perror(argv[7]); return 5; }
  ps_per_cycle = 1e12 / (double)f;
  fprintf(out, "$timescale 1ps $end\n$scope module avr $end\n$var wire 1 ! P%c%d $end\n$upscope $end\n$enddefinitions $end\n", port, bit);
  avr_irq_t *pin = avr_io_getirq(avr, AVR_IOCTL_IOPORT_GETIRQ(port), bit);
  avr_irq_t *dir = avr_io_getirq(avr, AVR_IOCTL_IOPORT_GETIRQ(port), IOPORT_IRQ_DIRECTION_ALL);
  if (!pin || !dir) { fprintf(stderr, "no port %c\n", port); return 6; }
  avr_irq_register_notify(pin, on_pin, NULL);
  avr_irq_register_notify(dir, on_ddr, NULL);
  emit();
  int next = 0;
  int state = cpu_Running;
  while (avr->cycle < cycles && state != cpu_Done && state != cpu_Crashed) {
    while (next < nev && avr->cycle >= at[next]) set_switch(in_port, mask[next++]);
    state = avr_run(avr);
  }
  fprintf(out, "#%.0f\n", (double)avr->cycle * ps_per_cycle);
  fclose(out);
  printf("cycles %llu state %d\n", (unsigned long long)avr->cycle, state);
  return state == cpu_Crashed ? 7 : 0;
}
