/* Runs an AVR image (Intel HEX, exactly as the bundle ships it) in libsimavr
 * (Debian libsimavr-dev 1.6) for a number of CPU cycles and writes one port
 * pin to a VCD file (IEEE 1364-2005 section 18), timescale 1 ps, time =
 * cycle / f. The pin reads 'z' while its DDR bit is 0: the output driver is
 * off, as the datasheets' port and compare-output-unit chapters say (the DDR
 * bit must be set for OCnx or PORTxn to reach the pin), so an image that
 * never enables its output shows no edges.
 * With the three optional arguments it first puts a fixed voltage on one ADC
 * input through libsimavr's ADC IRQs (avr_adc.h: millivolts on ADC_IRQ_ADCn,
 * AVcc from avr->avcc), so the firmware's conversions read a wiper position
 * the test chooses; every other channel stays at 0 mV, so firmware reading the
 * wrong channel sees the minimum.
 * usage: pin-trace <mcu> <f_hz> <image.hex> <port letter> <bit> <cycles> <out.vcd>
 *        [<adc channel> <mV> <avcc mV>]
 */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "sim_avr.h"
#include "sim_hex.h"
#include "avr_ioport.h"
#include "avr_adc.h"

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

int main(int argc, char **argv)
{
  if (argc != 8 && argc != 11) {
    fprintf(stderr, "usage: pin-trace <mcu> <f_hz> <image.hex> <port> <bit> <cycles> <out.vcd> [<channel> <mV> <avcc mV>]\n");
    return 2;
  }
  const char *mcu = argv[1];
  unsigned long f = strtoul(argv[2], NULL, 10);
  char port = argv[4][0];
  bit = atoi(argv[5]);
  unsigned long long cycles = strtoull(argv[6], NULL, 10);
  avr = avr_make_mcu_by_name(mcu);
  if (!avr) { fprintf(stderr, "simavr has no core %s\n", mcu); return 3; }
  avr_init(avr);
  avr->frequency = f;
  avr->log = 0;
  if (argc == 11) avr->vcc = avr->avcc = avr->aref = (uint32_t)strtoul(argv[10], NULL, 10);
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
  if (argc == 11) {
    avr_irq_t *adc = avr_io_getirq(avr, AVR_IOCTL_ADC_GETIRQ, atoi(argv[8]));
    if (!adc) { fprintf(stderr, "no ADC channel %s\n", argv[8]); return 8; }
    avr_raise_irq(adc, (uint32_t)strtoul(argv[9], NULL, 10));
  }
  emit();
  int state = cpu_Running;
  while (avr->cycle < cycles && state != cpu_Done && state != cpu_Crashed) state = avr_run(avr);
  fprintf(out, "#%.0f\n", (double)avr->cycle * ps_per_cycle);
  fclose(out);
  printf("cycles %llu state %d\n", (unsigned long long)avr->cycle, state);
  return state == cpu_Crashed ? 7 : 0;
}
