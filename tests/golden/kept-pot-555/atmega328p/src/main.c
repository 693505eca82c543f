/* ATmega328P replacement timing stage with the old stage's rate potentiometer kept
 * Control: pot as rb, 47000 ohm track, linear + 2200 ohm in series; wiper on PC0 (ADC0), read 10-bit,
 * 64 steps of 16 counts, hysteresis 2 counts.
 * Timer1 fast PWM mode 14 (TOP = ICR1) on OC1A = PB1, divider 8, clock 16.00000 MHz.
 * Period per step: the old stage's own law, computed by the engine (table below).
 * Register names: ATmega328P datasheet (DS40002061), chapters "16-bit Timer/Counter1"
 * and "Analog-to-Digital Converter" (ADMUX, ADCSRA, ADCSRB, DIDR0).
 */
#include <avr/io.h>
#include <avr/interrupt.h>
#include <avr/pgmspace.h>
#include <avr/power.h>
#include <avr/sleep.h>
#include <stdint.h>

#if F_CPU != 16000000UL
#error "F_CPU differs from the clock this table was solved for"
#endif

#define ADJ_STEPS 64u
#define ADJ_COUNTS_PER_STEP 16u
#define ADJ_HYSTERESIS 2u

/* TOP (ICR1 = period counts - 1) and compare (OCR1A = high counts - 1) per step. */
static const uint16_t adj_top[ADJ_STEPS] PROGMEM = {
  748u, /* minimum */
  954u,
  1161u,
  1368u,
  1575u,
  1782u,
  1989u,
  2196u,
  2402u,
  2609u,
  2816u,
  3023u,
  3230u,
  3437u,
  3643u,
  3850u,
  4057u,
  4264u,
  4471u,
  4678u,
  4884u,
  5091u,
  5298u,
  5505u,
  5712u,
  5919u,
  6126u,
  6332u,
  6539u,
  6746u,
  6953u,
  7160u,
  7367u, /* middle */
  7573u,
  7780u,
  7987u,
  8194u,
  8401u,
  8608u,
  8815u,
  9021u,
  9228u,
  9435u,
  9642u,
  9849u,
  10056u,
  10262u,
  10469u,
  10676u,
  10883u,
  11090u,
  11297u,
  11503u,
  11710u,
  11917u,
  12124u,
  12331u,
  12538u,
  12745u,
  12951u,
  13158u,
  13365u,
  13572u,
  13779u, /* maximum */
};
static const uint16_t adj_ocr[ADJ_STEPS] PROGMEM = {
  443u,
  546u,
  649u,
  753u,
  856u,
  960u,
  1063u,
  1167u,
  1270u,
  1373u,
  1477u,
  1580u,
  1684u,
  1787u,
  1891u,
  1994u,
  2097u,
  2201u,
  2304u,
  2408u,
  2511u,
  2614u,
  2718u,
  2821u,
  2925u,
  3028u,
  3132u,
  3235u,
  3338u,
  3442u,
  3545u,
  3649u,
  3752u,
  3856u,
  3959u,
  4062u,
  4166u,
  4269u,
  4373u,
  4476u,
  4579u,
  4683u,
  4786u,
  4890u,
  4993u,
  5097u,
  5200u,
  5303u,
  5407u,
  5510u,
  5614u,
  5717u,
  5821u,
  5924u,
  6027u,
  6131u,
  6234u,
  6338u,
  6441u,
  6545u,
  6648u,
  6751u,
  6855u,
  6958u,
};

static volatile uint8_t adj_pending;
static uint8_t adj_applied;

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

static void adj_apply(uint8_t step)
{
  ICR1 = pgm_read_word(&adj_top[step]);
  OCR1A = pgm_read_word(&adj_ocr[step]);
  adj_applied = step;
}

/* Conversion complete (free running): pick the step; the timer applies it. */
ISR(ADC_vect)
{
  adj_pending = adj_step(ADC, adj_pending);
}

/* TOV1 is set at TOP in mode 14, so the counter has just restarted from 0:
 * ICR1 is not double buffered, and writing it here keeps the new TOP above
 * the count (a TOP below the count would run the counter to 0xFFFF once). */
ISR(TIMER1_OVF_vect)
{
  uint8_t s = adj_pending;
  if (s != adj_applied) {
    adj_apply(s);
  }
}

int main(void)
{
  clock_prescale_set(clock_div_1);

  /* ADC: reference AVcc with the capacitor at AREF (REFS1:0 = 01), channel ADC0;
   * digital input buffer off on the wiper pin (DIDR0). ADC clock F_CPU/128 =
   * 125.0000 kHz, inside the 50..200 kHz the datasheet asks for full resolution. */
  ADMUX = (1 << REFS0) | 0;
  DIDR0 = (1 << ADC0D);
  ADCSRA = (1 << ADEN) | (1 << ADPS2) | (1 << ADPS1) | (1 << ADPS0);
  /* One conversion before the output starts, so the first period is already the knob's. */
  ADCSRA |= (1 << ADSC);
  while (ADCSRA & (1 << ADSC)) {
  }
  adj_pending = adj_step(ADC, (uint8_t)(ADC / ADJ_COUNTS_PER_STEP));
  adj_apply(adj_pending);

  /* PB1 as output (OC1A) */
  DDRB |= (1 << DDB1);
  /* Timer1 fast PWM mode 14: WGM13:0 = 1110, clear OC1A on compare, set at BOTTOM */
  TCCR1A = (1 << COM1A1) | (1 << WGM11);
  TIMSK1 = (1 << TOIE1);
  TCCR1B = (1 << WGM13) | (1 << WGM12) | (1 << CS11);

  /* Free running conversions (ADCSRB ADTS = 000) with the conversion interrupt. */
  ADCSRB = 0;
  ADCSRA = (1 << ADEN) | (1 << ADSC) | (1 << ADATE) | (1 << ADIE) | (1 << ADPS2) | (1 << ADPS1) | (1 << ADPS0);

  /* Idle sleep keeps Timer1 and the ADC running. */
  set_sleep_mode(SLEEP_MODE_IDLE);
  sei();
  for (;;) {
    sleep_mode();
  }
}
