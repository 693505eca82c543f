/* ATtiny85 replacement timing stage with the old stage's rate potentiometer kept
 * Control: pot as rb, 47000 ohm track, linear + 2200 ohm in series; wiper on PB2 (ADC1), read 10-bit,
 * 64 steps of 16 counts, hysteresis 2 counts.
 * Timer0 fast PWM mode 7 (TOP = OCR0A) on OC0B = PB1, divider 256, clock 8.000000 MHz.
 * Period per step: the old stage's own law, computed by the engine (table below).
 * Register names: ATtiny25/45/85 datasheet, chapters "8-bit Timer/Counter0 with PWM"
 * and "Analog to Digital Converter" (ADMUX, ADCSRA, ADCSRB, DIDR0).
 */
#include <avr/io.h>
#include <avr/interrupt.h>
#include <avr/pgmspace.h>
#include <avr/power.h>
#include <avr/sleep.h>
#include <stdint.h>

#if F_CPU != 8000000UL
#error "F_CPU differs from the clock this table was solved for"
#endif

#define ADJ_STEPS 64u
#define ADJ_COUNTS_PER_STEP 16u
#define ADJ_HYSTERESIS 2u

/* TOP (OCR0A = period counts - 1) and compare (OCR0B = high counts - 1) per step. */
static const uint8_t adj_top[ADJ_STEPS] PROGMEM = {
  11u, /* minimum */
  14u,
  17u,
  20u,
  24u,
  27u,
  30u,
  33u,
  37u,
  40u,
  43u,
  46u,
  49u,
  53u,
  56u,
  59u,
  62u,
  66u,
  69u,
  72u,
  75u,
  79u,
  82u,
  85u,
  88u,
  91u,
  95u,
  98u,
  101u,
  104u,
  108u,
  111u,
  114u,
  117u,
  121u,
  124u,
  127u,
  130u,
  134u,
  137u,
  140u,
  143u,
  146u,
  150u,
  153u,
  156u,
  159u,
  163u,
  166u,
  169u,
  172u,
  176u,
  179u,
  182u,
  185u,
  188u,
  192u,
  195u,
  198u,
  201u,
  205u,
  208u,
  211u,
  214u, /* maximum */
};
static const uint8_t adj_ocr[ADJ_STEPS] PROGMEM = {
  6u,
  8u,
  9u,
  11u,
  12u,
  14u,
  16u,
  17u,
  19u,
  20u,
  22u,
  24u,
  25u,
  27u,
  29u,
  30u,
  32u,
  33u,
  35u,
  37u,
  38u,
  40u,
  41u,
  43u,
  45u,
  46u,
  48u,
  50u,
  51u,
  53u,
  54u,
  56u,
  58u,
  59u,
  61u,
  62u,
  64u,
  66u,
  67u,
  69u,
  71u,
  72u,
  74u,
  75u,
  77u,
  79u,
  80u,
  82u,
  83u,
  85u,
  87u,
  88u,
  90u,
  92u,
  93u,
  95u,
  96u,
  98u,
  100u,
  101u,
  103u,
  105u,
  106u,
  108u,
};

static volatile uint8_t adj_step_now;

/* Keeps the present step while the reading stays within ADJ_HYSTERESIS counts
 * of its edges, so noise on the wiper cannot make the output hunt between
 * adjacent steps. */
static uint8_t adj_step(uint16_t count, uint8_t current)
{
  uint16_t lo = (uint16_t)current * ADJ_COUNTS_PER_STEP;
  uint16_t hi = lo + ADJ_COUNTS_PER_STEP - 1u;
  if (count + ADJ_HYSTERESIS >= lo && count <= hi + ADJ_HYSTERESIS) {
    return current;
  }
  return (uint8_t)(count / ADJ_COUNTS_PER_STEP);
}

/* OCR0A and OCR0B are double buffered in the PWM modes (updated at BOTTOM),
 * so they may be written at any time without a short or stretched period. */
static void adj_apply(uint8_t step)
{
  OCR0A = pgm_read_byte(&adj_top[step]);
  OCR0B = pgm_read_byte(&adj_ocr[step]);
}

/* Conversion complete (free running). */
ISR(ADC_vect)
{
  uint8_t s = adj_step(ADC, adj_step_now);
  if (s != adj_step_now) {
    adj_step_now = s;
    adj_apply(s);
  }
}

int main(void)
{
  clock_prescale_set(clock_div_1);

  /* ADC: VCC as reference (REFS2:0 = 000), channel ADC1; digital input buffer
   * off on the wiper pin (DIDR0). ADC clock F_CPU/64 = 125.0000 kHz,
   * inside the 50..200 kHz the datasheet asks for full resolution. */
  ADMUX = 1;
  DIDR0 = (1 << ADC1D);
  ADCSRA = (1 << ADEN) | (1 << ADPS2) | (1 << ADPS1);
  /* One conversion before the output starts, so the first period is already the knob's. */
  ADCSRA |= (1 << ADSC);
  while (ADCSRA & (1 << ADSC)) {
  }
  adj_step_now = adj_step(ADC, (uint8_t)(ADC / ADJ_COUNTS_PER_STEP));
  adj_apply(adj_step_now);

  /* PB1 as output (OC0B) */
  DDRB |= (1 << DDB1);
  /* Timer0 fast PWM mode 7 (WGM02:0 = 111), clear OC0B on compare, set at BOTTOM */
  TCCR0A = 0x23;
  TCCR0B = 0x0C;

  /* Free running conversions (ADCSRB ADTS = 000) with the conversion interrupt. */
  ADCSRB = 0;
  ADCSRA = (1 << ADEN) | (1 << ADSC) | (1 << ADATE) | (1 << ADIE) | (1 << ADPS2) | (1 << ADPS1);

  /* Idle sleep keeps Timer0 and the ADC running. */
  set_sleep_mode(SLEEP_MODE_IDLE);
  sei();
  for (;;) {
    sleep_mode();
  }
}
