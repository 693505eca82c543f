/* ATtiny85 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r3, engine 1.0.0; target 6 (attiny85-6)
 * TIMER1, mode isr, clock 8.000000 MHz, output PB1 (GPIO, pin 6)
 * Period 1.000000 s (+0.000 ppm), high 250.0000 ms (+0.000 ppm)
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
  /* Full clock whatever CKDIV8 says (factory fuses divide by 8): CLKPR, ATtiny85
   * datasheet, System Clock Prescaler. The fuses for Crystal 1-20 MHz are in the Makefile. */
  clock_prescale_set(clock_div_1);

  /* PB1 as output (GPIO) */
  DDRB |= (1 << DDB1);

  /* interrupt every N*(1+OCR1C)/f = 64*250/F_CPU -> 0xF9 */
  OCR1C = 249;
  /* compare A at TOP raises the interrupt -> 0xF9 */
  OCR1A = 249;
  /* compare A interrupt on -> 0x40 */
  TIMSK = (1 << OCIE1A);
  /* clear on OCR1C, clock = F_CPU/64; starts the timer -> 0x87 */
  TCCR1 = (1 << CTC1) | (1 << CS10) | (1 << CS11) | (1 << CS12);

  /* Idle sleep between interrupts; the timer keeps running in idle mode. */
  set_sleep_mode(SLEEP_MODE_IDLE);
  sei();
  for (;;) {
    sleep_mode();
  }
}
