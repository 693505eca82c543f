/* ATmega328P replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r3, engine 1.0.0; target 4 (atmega328p-4)
 * TIMER0, mode pwm, clock 16.00000 MHz, output PD5 (OC0B, pin 11)
 * Period 1.000000 ms (+0.000 ppm), high 248.0000 us (-8000.000 ppm)
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

  /* PD5 as output (OC0B) */
  DDRD |= (1 << DDD5);

  /* TOP = periodCounts - 1; period = N*(1+OCR0A)/f = 64*250/F_CPU -> 0xF9 */
  OCR0A = 249;
  /* high for OCR0B+1 counts = 62 counts -> 0x3D */
  OCR0B = 61;
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
