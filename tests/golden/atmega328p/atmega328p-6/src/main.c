/* ATmega328P replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r3, engine 1.0.0; target 6 (atmega328p-6)
 * TIMER0, mode isr, clock 16.00000 MHz, output PD6 (GPIO, pin 12)
 * Period 1.000000 s (+0.000 ppm), high 250.0000 ms (+0.000 ppm)
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

/* Software divider: the pin follows the interrupt count. Each interrupt
 * first writes the level computed for the interval it starts, so both edges
 * see the same entry latency and the period stays exact. */
static volatile uint16_t tick;
static volatile uint8_t level_next = (0 < TIMING_HIGH_TICKS);

ISR(TIMER0_COMPA_vect)
{
  if (level_next) {
    PORTD |= (1 << PORTD6);
  } else {
    PORTD &= (uint8_t)~(1 << PORTD6);
  }
  uint16_t t = tick + 1;
  if (t >= TIMING_SOFT_DIVIDER) {
    t = 0;
  }
  tick = t;
  level_next = (t < TIMING_HIGH_TICKS);
}

int main(void)
{
  /* Full clock whatever CKDIV8 says (factory fuses divide by 8): CLKPR, ATmega328P
   * datasheet, System Clock Prescaler. The fuses for Crystal 1-20 MHz are in the Makefile. */
  clock_prescale_set(clock_div_1);

  /* PD6 as output (GPIO) */
  DDRD |= (1 << DDD6);

  /* interrupt every N*(1+OCR0A)/f = 256*125/F_CPU -> 0x7C */
  OCR0A = 124;
  /* compare A interrupt on -> 0x02 */
  TIMSK0 = (1 << OCIE0A);
  /* CTC, TOP = OCR0A; pin driven by the interrupt -> 0x02 */
  TCCR0A = (1 << WGM01);
  /* clock = F_CPU/256; starts the timer -> 0x04 */
  TCCR0B = (1 << CS02);

  /* Idle sleep between interrupts; the timer keeps running in idle mode. */
  set_sleep_mode(SLEEP_MODE_IDLE);
  sei();
  for (;;) {
    sleep_mode();
  }
}
