/* ATtiny85 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r1, engine 1.0.0; target 2 (attiny85)
 * TIMER0, mode pwm, clock 8.000000 MHz, output PB1 (OC0B, pin 6)
 * Period 1.456000 ms (+274.801 ppm), high 760.0000 us (-3147.954 ppm)
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

  /* PB1 as output (OC0B) */
  DDRB |= (1 << DDB1);

  /* TOP = periodCounts - 1; period = N*(1+OCR0A)/f = 64*182/F_CPU (the calibration constant) -> 0xB5 */
  OCR0A = (TRIM_PERIOD_COUNTS - 1u);
  /* high for OCR0B+1 counts = 95 counts (follows the calibration constant) -> 0x5E */
  OCR0B = (TRIM_HIGH_COUNTS - 1u);
  /* OC0B non-inverting, WGM01:0 = 11 -> 0x23 */
  TCCR0A = (1 << COM0B1) | (1 << WGM01) | (1 << WGM00);
  /* WGM02 = 1 (fast PWM, TOP = OCR0A), clock = F_CPU/64; starts the timer -> 0x0B */
  TCCR0B = (1 << WGM02) | (1 << CS00) | (1 << CS01);

  /* Idle sleep between interrupts; the timer keeps running in idle mode. */
  set_sleep_mode(SLEEP_MODE_IDLE);
  sei();
  for (;;) {
    sleep_mode();
  }
}
