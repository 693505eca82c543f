/* ATmega328P replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r3, engine 1.0.0; target 8 (atmega328p-8)
 * TIMER2, mode toggle, clock 16.00000 MHz, output PB3 (OC2A, pin 17)
 * Period 2.000000 ms (+0.000 ppm), high 1.000000 ms (+0.000 ppm)
 * Register values: ATmega328P datasheet, Timer/Counter chapters.
 */
#include <avr/io.h>
#include <avr/interrupt.h>
#include <avr/power.h>
#include <avr/sleep.h>
#include <stdint.h>
#include "timing.h"

#if F_CPU != 16000000UL
#error "F_CPU differs from the clock this plan was solved for"
#endif

int main(void)
{
  /* Full clock whatever CKDIV8 says (factory fuses divide by 8): CLKPR, ATmega328P
   * datasheet, System Clock Prescaler. The fuses for Crystal 1-20 MHz are in the Makefile. */
  clock_prescale_set(clock_div_1);

  /* PB3 as output (OC2A) */
  DDRB |= (1 << DDB3);

  /* TOP = periodCounts - 1; period = 2*N*(1+OCR2A)/f = 2*64*250/F_CPU -> 0xF9 */
  OCR2A = 249;
  /* toggle OC2A on compare match, CTC (TOP = OCR2A) -> 0x42 */
  TCCR2A = (1 << COM2A0) | (1 << WGM21);
  /* clock = F_CPU/64; starts the timer -> 0x04 */
  TCCR2B = (1 << CS22);

  /* Idle sleep between interrupts; the timer keeps running in idle mode. */
  set_sleep_mode(SLEEP_MODE_IDLE);
  sei();
  for (;;) {
    sleep_mode();
  }
}
