/* ATtiny85 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r3, engine 1.0.0; target 4 (attiny85-4)
 * TIMER1, mode pwm, clock 8.000000 MHz, output PB1 (OC1A, pin 6)
 * Period 1.000000 ms (+0.000 ppm), high 248.0000 us (-8000.000 ppm)
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

  /* PB1 as output (OC1A) */
  DDRB |= (1 << DDB1);

  /* TOP = periodCounts - 1; period = N*(1+OCR1C)/f = 32*250/F_CPU -> 0xF9 */
  OCR1C = 249;
  /* high for OCR1A+1 counts = 62 counts -> 0x3D */
  OCR1A = 61;
  /* PWM on OC1A, TOP = OCR1C, clock = F_CPU/32; starts the timer -> 0x66 */
  TCCR1 = (1 << PWM1A) | (1 << COM1A1) | (1 << CS11) | (1 << CS12);

  /* Idle sleep between interrupts; the timer keeps running in idle mode. */
  set_sleep_mode(SLEEP_MODE_IDLE);
  sei();
  for (;;) {
    sleep_mode();
  }
}
