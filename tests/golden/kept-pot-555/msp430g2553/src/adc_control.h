/* MSP430G2553: the old stage's rate potentiometer kept on A4 (P1.4, pin 6).
 * Control: pot as rb, 47000 ohm track, linear + 2200 ohm in series; 64 steps of 16 counts of the 10-bit ADC10,
 * hysteresis 2 counts. Only TA0CCR0 and TA0CCR1 change per step.
 * ADC10 (SLAU144, ADC10 chapter): reference VCC/VSS (SREF_0), 64 ADC10CLK sample time
 * (ADC10SHT_3), ADC10CLK SMCLK/1 = 1000000 Hz, inside 450000..6300000 Hz; one conversion started by ADC10SC each time.
 * main.c calls adc_control_init() after its own set-up and adc_control_poll() in its loop.
 */
#ifndef ADC_CONTROL_H
#define ADC_CONTROL_H
#include <msp430.h>
#include <stdint.h>

#define ADJ_STEPS 64u
#define ADJ_COUNTS_PER_STEP 16u
#define ADJ_HYSTERESIS 2u

/* TA0CCR0 (period counts - 1) and TA0CCR1 (high counts) per step. */
static const uint16_t adj_ccr0[ADJ_STEPS] = {
  373u, /* minimum */
  477u,
  580u,
  684u,
  787u,
  890u,
  994u,
  1097u,
  1201u,
  1304u,
  1408u,
  1511u,
  1614u,
  1718u,
  1821u,
  1925u,
  2028u,
  2131u,
  2235u,
  2338u,
  2442u,
  2545u,
  2649u,
  2752u,
  2855u,
  2959u,
  3062u,
  3166u,
  3269u,
  3373u,
  3476u,
  3579u,
  3683u,
  3786u,
  3890u,
  3993u,
  4096u,
  4200u,
  4303u,
  4407u,
  4510u,
  4614u,
  4717u,
  4820u,
  4924u,
  5027u,
  5131u,
  5234u,
  5338u,
  5441u,
  5544u,
  5648u,
  5751u,
  5855u,
  5958u,
  6062u,
  6165u,
  6268u,
  6372u,
  6475u,
  6579u,
  6682u,
  6785u,
  6889u, /* maximum */
};
static const uint16_t adj_ccr1[ADJ_STEPS] = {
  222u,
  274u,
  325u,
  377u,
  429u,
  480u,
  532u,
  584u,
  635u,
  687u,
  739u,
  791u,
  842u,
  894u,
  946u,
  997u,
  1049u,
  1101u,
  1153u,
  1204u,
  1256u,
  1308u,
  1359u,
  1411u,
  1463u,
  1515u,
  1566u,
  1618u,
  1670u,
  1721u,
  1773u,
  1825u,
  1877u,
  1928u,
  1980u,
  2032u,
  2083u,
  2135u,
  2187u,
  2239u,
  2290u,
  2342u,
  2394u,
  2445u,
  2497u,
  2549u,
  2601u,
  2652u,
  2704u,
  2756u,
  2807u,
  2859u,
  2911u,
  2962u,
  3014u,
  3066u,
  3118u,
  3169u,
  3221u,
  3273u,
  3324u,
  3376u,
  3428u,
  3480u,
};
static uint8_t adj_now;

static uint16_t adj_read(void)
{
  ADC10CTL0 |= ENC | ADC10SC;
  while (ADC10CTL1 & ADC10BUSY) {
  }
  return ADC10MEM;
}

/* Keeps the present step while the reading stays within ADJ_HYSTERESIS counts of its edges. */
static uint8_t adj_step(uint16_t count, uint8_t current)
{
  uint16_t lo = (uint16_t)current * ADJ_COUNTS_PER_STEP;
  uint16_t hi = lo + ADJ_COUNTS_PER_STEP - 1u;
  if (count + ADJ_HYSTERESIS >= lo && count <= hi + ADJ_HYSTERESIS) {
    return current;
  }
  uint16_t s = count / ADJ_COUNTS_PER_STEP;
  return (uint8_t)(s < ADJ_STEPS ? s : ADJ_STEPS - 1u);
}

/* In up mode a TACCR0 below the running count makes the timer roll to zero at once, so
 * both compare registers are written just after the period restarts (CCIFG of TACCR0). */
static void adj_apply(uint8_t step)
{
  TA0CCTL0 &= (uint16_t)~CCIFG;
  while (!(TA0CCTL0 & CCIFG)) {
  }
  TA0CCR0 = adj_ccr0[step];
  TA0CCR1 = adj_ccr1[step];
}

static void adc_control_init(void)
{
  ADC10CTL0 = 0; /* ENC = 0 (control bits change only then), ADC off: the reset state */
  ADC10AE0 = BIT4; /* P1.4 the only analog input */
  ADC10CTL1 = INCH_4 | SHS_0 | ADC10DIV_0 | ADC10SSEL_3 | CONSEQ_0;
  ADC10CTL0 = SREF_0 | ADC10SHT_3 | ADC10ON;
  adj_now = (uint8_t)(adj_read() / ADJ_COUNTS_PER_STEP);
  adj_apply(adj_now);
}

static void adc_control_poll(void)
{
  uint8_t s = adj_step(adj_read(), adj_now);
  if (s != adj_now) {
    adj_now = s;
    adj_apply(s);
  }
}

#endif
