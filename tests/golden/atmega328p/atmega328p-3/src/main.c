/* ATmega328P replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r3, engine 1.0.0; target 3 (atmega328p-3)
 * TIMER1, mode isr, clock 16.00000 MHz, output PB1 (GPIO, pin 15)
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

ISR(TIMER1_COMPA_vect)
{
  if (level_next) {
    PORTB |= (1 << PORTB1);
  } else {
    PORTB &= (uint8_t)~(1 << PORTB1);
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

  /* PB1 as output (GPIO) */
  DDRB |= (1 << DDB1);

  /* interrupt every N*(1+OCR1A)/f = 64*62500/F_CPU -> 0xF423 */
  OCR1A = 62499;
  /* compare A interrupt on -> 0x02 */
  TIMSK1 = (1 << OCIE1A);
  /* pin driven by the interrupt, not by the timer -> 0x00 */
  TCCR1A = 0;
  /* CTC, TOP = OCR1A, clock = F_CPU/64; starts the timer -> 0x0B */
  TCCR1B = (1 << WGM12) | (1 << CS10) | (1 << CS11);

  /* Idle sleep between interrupts; the timer keeps running in idle mode. */
  set_sleep_mode(SLEEP_MODE_IDLE);
  sei();
  for (;;) {
    sleep_mode();
  }
}
