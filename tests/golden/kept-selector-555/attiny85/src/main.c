/* ATtiny85 replacement timing stage with the old stage's selector switch kept
 * Control: selector on c; 3 positions, one input per position on PORTB
 * (internal pull-up, the switch's common contact to ground: the selected position reads low),
 * debounced over 20 samples 1 ms apart.
 * While no position or more than one reads low (the switch between contacts), the output keeps the last position's timing.
 * Timer0 fast PWM mode 7 (TOP = OCR0A) on OC0B = PB1, divider 256, clock 8.000000 MHz.
 * Period per position: the old stage's own, computed by the engine (table below).
 * Register names: ATtiny25/45/85 datasheet, chapters "I/O Ports" and
 * "8-bit Timer/Counter0 with PWM".
 */
#include <avr/io.h>
#include <avr/pgmspace.h>
#include <avr/power.h>
#include <stdint.h>
#include <util/delay.h>

#if F_CPU != 8000000UL
#error "F_CPU differs from the clock this table was solved for"
#endif

#define SEL_POSITIONS 3u
#define SEL_MASK 0x0Du
#define SEL_DEBOUNCE_MS 20u
#define SEL_NONE 0xFFu

/* PORTB bit, TOP (OCR0A = period counts - 1) and compare (OCR0B = high counts - 1) per position. */
static const uint8_t sel_bit[SEL_POSITIONS] = {
  0u, /* position 1 */
  2u, /* position 2 */
  3u, /* position 3 */
};
static const uint8_t sel_top[SEL_POSITIONS] PROGMEM = {
  20u,
  44u,
  99u,
};
static const uint8_t sel_ocr[SEL_POSITIONS] PROGMEM = {
  10u,
  23u,
  51u,
};

/* The position whose contact reads low; SEL_NONE when none or more than one does. */
static uint8_t sel_read(void)
{
  uint8_t low = (uint8_t)(~PINB & SEL_MASK);
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

/* OCR0A and OCR0B are double buffered in the PWM modes (updated at BOTTOM),
 * so they may be written at any time without a short or stretched period. */
static void sel_apply(uint8_t i)
{
  OCR0A = pgm_read_byte(&sel_top[i]);
  OCR0B = pgm_read_byte(&sel_ocr[i]);
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

  /* Selector inputs: DDRB bits 0, PORTB bits 1 (pull-ups on). */
  DDRB &= (uint8_t)~SEL_MASK;
  PORTB |= SEL_MASK;
  uint8_t first = sel_debounced();
  uint8_t now = (first == SEL_NONE) ? 1u : first; /* no contact: the stored value's position */
  sel_apply(now);

  /* PB1 as output (OC0B) */
  DDRB |= (1 << DDB1);
  /* Timer0 fast PWM mode 7 (WGM02:0 = 111), clear OC0B on compare, set at BOTTOM */
  TCCR0A = 0x23;
  TCCR0B = 0x0C;

  for (;;) {
    uint8_t s = sel_debounced();
    if (s != SEL_NONE && s != now) {
      now = s;
      sel_apply(s);
    }
  }
}
