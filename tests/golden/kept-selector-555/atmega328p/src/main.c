/* ATmega328P replacement timing stage with the old stage's selector switch kept
 * Control: selector on c; 3 positions, one input per position on PORTD
 * (internal pull-up, the switch's common contact to ground: the selected position reads low),
 * debounced over 20 samples 1 ms apart.
 * While no position or more than one reads low (the switch between contacts), the output keeps the last position's timing.
 * Timer1 fast PWM mode 14 (TOP = ICR1) on OC1A = PB1, divider 1, clock 16.00000 MHz.
 * Period per position: the old stage's own, computed by the engine (table below).
 * Register names: ATmega328P datasheet DS40002061, chapters "I/O-Ports" and
 * "16-bit Timer/Counter1 with PWM".
 */
#include <avr/io.h>
#include <avr/interrupt.h>
#include <avr/pgmspace.h>
#include <avr/power.h>
#include <stdint.h>
#include <util/delay.h>

#if F_CPU != 16000000UL
#error "F_CPU differs from the clock this table was solved for"
#endif

#define SEL_POSITIONS 3u
#define SEL_MASK 0x1Cu
#define SEL_DEBOUNCE_MS 20u
#define SEL_NONE 0xFFu

/* PORTD bit, TOP (ICR1 = period counts - 1) and compare (OCR1A = high counts - 1) per position. */
static const uint8_t sel_bit[SEL_POSITIONS] = {
  2u, /* position 1 */
  3u, /* position 2 */
  4u, /* position 3 */
};
static const uint16_t sel_top[SEL_POSITIONS] PROGMEM = {
  10945u,
  23289u,
  51236u,
};
static const uint16_t sel_ocr[SEL_POSITIONS] PROGMEM = {
  5733u,
  12198u,
  26838u,
};

static volatile uint8_t sel_pending;
static uint8_t sel_applied;

/* The position whose contact reads low; SEL_NONE when none or more than one does. */
static uint8_t sel_read(void)
{
  uint8_t low = (uint8_t)(~PIND & SEL_MASK);
  uint8_t found = SEL_NONE;
  for (uint8_t i = 0; i < SEL_POSITIONS; i++) {
    if (low & (uint8_t)(1u << sel_bit[i])) {
      if (found != SEL_NONE) {
        return SEL_NONE;
      }
      found = i;
    }
  }
  return found;
}

static void sel_apply(uint8_t i)
{
  ICR1 = pgm_read_word(&sel_top[i]);
  OCR1A = pgm_read_word(&sel_ocr[i]);
  sel_applied = i;
}

/* TOV1 is set at TOP in mode 14, so the counter has just restarted from 0:
 * ICR1 is not double buffered, and writing it here keeps the new TOP above the count. */
ISR(TIMER1_OVF_vect)
{
  uint8_t s = sel_pending;
  if (s != sel_applied) {
    sel_apply(s);
  }
}

/* One reading that stayed the same for SEL_DEBOUNCE_MS samples 1 ms apart. */
static uint8_t sel_debounced(void)
{
  uint8_t seen = sel_read();
  uint8_t same = 0;
  while (same < SEL_DEBOUNCE_MS) {
    _delay_ms(1);
    uint8_t now = sel_read();
    if (now == seen) {
      same++;
    } else {
      seen = now;
      same = 0;
    }
  }
  return seen;
}

int main(void)
{
  clock_prescale_set(clock_div_1);

  /* Selector inputs: DDRD bits 0, PORTD bits 1 (pull-ups on). */
  DDRD &= (uint8_t)~SEL_MASK;
  PORTD |= SEL_MASK;
  uint8_t first = sel_debounced();
  sel_pending = (first == SEL_NONE) ? 1u : first; /* no contact: the stored value's position */
  sel_apply(sel_pending);

  /* PB1 as output (OC1A) */
  DDRB |= (1 << DDB1);
  /* Timer1 fast PWM mode 14: WGM13:0 = 1110, clear OC1A on compare, set at BOTTOM */
  TCCR1A = (1 << COM1A1) | (1 << WGM11);
  TIMSK1 = (1 << TOIE1);
  TCCR1B = (1 << WGM13) | (1 << WGM12) | (1 << CS10);
  sei();

  for (;;) {
    uint8_t s = sel_debounced();
    if (s != SEL_NONE) {
      sel_pending = s;
    }
  }
}
