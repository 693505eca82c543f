/* ATtiny85 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r3, engine 1.0.0; target 2 (attiny85-2)
 * TIMER0, mode toggle, clock 8.000000 MHz, output PB0 (OC0A, pin 5)
 * Period 2.000000 ms (+0.000 ppm), high 1.000000 ms (+0.000 ppm)
 * Register values: ATtiny85 datasheet, Timer/Counter chapters.
 */
#include <avr/io.h>
#include <avr/interrupt.h>
#include <avr/power.h>
#include <avr/sleep.h>
#include <stdint.h>
#include "timing.h"

#if F_CPU != 8000000UL
#error "F_CPU differs from the clock this plan was solved for"
#endif

int main(void)
{
  /* Full clock whatever CKDIV8 says (factory fuses divide by 8): CLKPR, ATtiny85
   * datasheet, System Clock Prescaler. The fuses for Crystal 1-20 MHz are in the Makefile. */
  clock_prescale_set(clock_div_1);

  /* PB0 as output (OC0A) */
  DDRB |= (1 << DDB0);

  /* TOP = periodCounts - 1; period = 2*N*(1+OCR0A)/f = 2*64*125/F_CPU -> 0x7C */
  OCR0A = 124;
  /* toggle OC0A on compare match, CTC (TOP = OCR0A) -> 0x42 */
  TCCR0A = (1 << COM0A0) | (1 << WGM01);
  /* clock = F_CPU/64; starts the timer -> 0x03 */
  TCCR0B = (1 << CS00) | (1 << CS01);

  /* Idle sleep between interrupts; the timer keeps running in idle mode. */
  set_sleep_mode(SLEEP_MODE_IDLE);
  sei();
  for (;;) {
    sleep_mode();
  }
}
