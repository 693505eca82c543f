/* ATmega328P replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r3, engine 1.0.0; target 2 (atmega328p-2)
 * TIMER1, mode toggle, clock 16.00000 MHz, output PB1 (OC1A, pin 15)
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

  /* PB1 as output (OC1A) */
  DDRB |= (1 << DDB1);

  /* TOP = periodCounts - 1; period = 2*N*(1+OCR1A)/f = 2*1*16000/F_CPU -> 0x3E7F */
  OCR1A = 15999;
  /* toggle OC1A on compare match, WGM11:10 = 00 -> 0x40 */
  TCCR1A = (1 << COM1A0);
  /* WGM13:0 = 0100 (CTC, TOP = OCR1A), clock = F_CPU/1; starts the timer -> 0x09 */
  TCCR1B = (1 << WGM12) | (1 << CS10);

  /* Idle sleep between interrupts; the timer keeps running in idle mode. */
  set_sleep_mode(SLEEP_MODE_IDLE);
  sei();
  for (;;) {
    sleep_mode();
  }
}
