/* ATmega328P replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r3, engine 1.0.0; target 7 (atmega328p-7)
 * TIMER2, mode pwm, clock 16.00000 MHz, output PD3 (OC2B, pin 5)
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

  /* PD3 as output (OC2B) */
  DDRD |= (1 << DDD3);

  /* TOP = periodCounts - 1; period = N*(1+OCR2A)/f = 64*250/F_CPU -> 0xF9 */
  OCR2A = 249;
  /* high for OCR2B+1 counts = 62 counts -> 0x3D */
  OCR2B = 61;
  /* OC2B non-inverting, WGM21:0 = 11 -> 0x23 */
  TCCR2A = (1 << COM2B1) | (1 << WGM21) | (1 << WGM20);
  /* WGM22 = 1 (fast PWM, TOP = OCR2A), clock = F_CPU/64; starts the timer -> 0x0C */
  TCCR2B = (1 << WGM22) | (1 << CS22);

  /* Idle sleep between interrupts; the timer keeps running in idle mode. */
  set_sleep_mode(SLEEP_MODE_IDLE);
  sei();
  for (;;) {
    sleep_mode();
  }
}
