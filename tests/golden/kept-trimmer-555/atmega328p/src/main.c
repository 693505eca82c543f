/* ATmega328P replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r1, engine 1.0.0; target 1 (atmega328p)
 * TIMER1, mode pwm, clock 16.00000 MHz, output PB1 (OC1A, pin 15)
 * Period 1.455625 ms (+17.175 ppm), high 762.3750 us (-32.791 ppm)
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

  /* TOP = periodCounts - 1; period = N*(1+TOP)/f = 1*23290/F_CPU (the calibration constant) -> 0x5AF9 */
  ICR1 = (TRIM_PERIOD_COUNTS - 1u);
  /* high for OCR1A+1 counts = 12198 counts (follows the calibration constant) -> 0x2FA5 */
  OCR1A = (TRIM_HIGH_COUNTS - 1u);
  /* non-inverting, WGM11:10 = 10 -> 0x82 */
  TCCR1A = (1 << COM1A1) | (1 << WGM11);
  /* WGM13:12 = 11 (fast PWM, TOP = ICR1), clock = F_CPU/1; starts the timer -> 0x19 */
  TCCR1B = (1 << WGM13) | (1 << WGM12) | (1 << CS10);

  /* Idle sleep between interrupts; the timer keeps running in idle mode. */
  set_sleep_mode(SLEEP_MODE_IDLE);
  sei();
  for (;;) {
    sleep_mode();
  }
}
