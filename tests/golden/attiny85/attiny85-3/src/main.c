/* ATtiny85 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r3, engine 1.0.0; target 3 (attiny85-3)
 * TIMER0, mode isr, clock 8.000000 MHz, output PB0 (GPIO, pin 5)
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

ISR(TIMER0_COMPA_vect)
{
  if (level_next) {
    PORTB |= (1 << PORTB0);
  } else {
    PORTB &= (uint8_t)~(1 << PORTB0);
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

  /* PB0 as output (GPIO) */
  DDRB |= (1 << DDB0);

  /* interrupt every N*(1+OCR0A)/f = 64*250/F_CPU -> 0xF9 */
  OCR0A = 249;
  /* compare A interrupt on -> 0x10 */
  TIMSK = (1 << OCIE0A);
  /* CTC, TOP = OCR0A; pin driven by the interrupt -> 0x02 */
  TCCR0A = (1 << WGM01);
  /* clock = F_CPU/64; starts the timer -> 0x03 */
  TCCR0B = (1 << CS00) | (1 << CS01);

  /* Idle sleep between interrupts; the timer keeps running in idle mode. */
  set_sleep_mode(SLEEP_MODE_IDLE);
  sei();
  for (;;) {
    sleep_mode();
  }
}
