/* PIC12F1840: the old stage's rate potentiometer kept on AN3 (RA4, pin 3),
 * for builds with the vendor's C compiler; the image is built from adc_control.inc, the same steps.
 * Control: pot as rb, 47000 ohm track, linear + 2200 ohm in series; 64 steps of 16 counts of the 10-bit ADC,
 * hysteresis 2 counts. Only PR2 and CCPR1L change per step (DC1B stays 0).
 * ADC: DS40001441 ADC chapter. Reference VDD (ADPREF = 00), right justified (ADFM = 1),
 * ADCS = 001: TAD = Fosc/8 = 1 us, inside the datasheet's 1.0..6.0 us.
 * main.c calls adc_control_init() after its own set-up and adc_control_poll() in its loop.
 */
#ifndef ADC_CONTROL_H
#define ADC_CONTROL_H
#include <xc.h>
#include <stdint.h>

#define ADJ_STEPS 64u
#define ADJ_COUNTS_PER_STEP 16u
#define ADJ_HYSTERESIS 2u

/* PR2 (period counts - 1) and CCPR1L (high counts) per step. */
static const uint8_t adj_pr2[ADJ_STEPS] = {
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
static const uint8_t adj_ccpr1l[ADJ_STEPS] = {
  7u,
  9u,
  10u,
  12u,
  13u,
  15u,
  17u,
  18u,
  20u,
  21u,
  23u,
  25u,
  26u,
  28u,
  30u,
  31u,
  33u,
  34u,
  36u,
  38u,
  39u,
  41u,
  42u,
  44u,
  46u,
  47u,
  49u,
  51u,
  52u,
  54u,
  55u,
  57u,
  59u,
  60u,
  62u,
  63u,
  65u,
  67u,
  68u,
  70u,
  72u,
  73u,
  75u,
  76u,
  78u,
  80u,
  81u,
  83u,
  84u,
  86u,
  88u,
  89u,
  91u,
  93u,
  94u,
  96u,
  97u,
  99u,
  101u,
  102u,
  104u,
  106u,
  107u,
  109u,
};
static uint8_t adj_now;

static uint16_t adj_read(void)
{
  for (volatile uint8_t n = 4u; n != 0u; n--) {
  } /* acquisition time, about 6 us */
  ADCON0bits.GO_nDONE = 1;
  while (ADCON0bits.GO_nDONE) {
  }
  return (uint16_t)(((uint16_t)ADRESH << 8) | ADRESL);
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

/* CCPR1L is latched at the end of the running period; PR2 is not buffered, so it is
 * written just after TMR2IF, while TMR2 is below any new PR2. */
static void adj_apply(uint8_t step)
{
  CCPR1L = adj_ccpr1l[step];
  PIR1bits.TMR2IF = 0;
  while (!PIR1bits.TMR2IF) {
  }
  PR2 = adj_pr2[step];
}

static void adc_control_init(void)
{
  ANSELAbits.ANSA4 = 1; /* RA4 analog */
  TRISAbits.TRISA4 = 1;
  ADCON1 = 0x90; /* ADFM = 1, ADCS = 001, ADPREF = 00 (VDD) */
  ADCON0 = 0x0D; /* CHS = AN3, ADON = 1 */
  CCP1CON = 0x0C;   /* DC1B = 00, CCP1M = 1100 (PWM, active high) */
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
