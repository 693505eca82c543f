/* STM32G031: the old stage's rate potentiometer kept on ADC_IN4 (PA4).
 * Control: pot as rb, 47000 ohm track, linear + 2200 ohm in series; 64 steps of 64 counts of the 12-bit ADC,
 * hysteresis 2 counts. TIM2 channel 1: only ARR and CCR1 change per step;
 * both are preloaded (ARPE, OC1PE) and take effect at the next update event.
 * Register offsets and fields: RM0444, ADC chapter (ADC_ISR, ADC_CR, ADC_CFGR2 CKMODE, ADC_SMPR,
 * ADC_CHSELR, ADC_DR) and RCC (APBENR2 ADCEN); bit positions from memory.
 * ADC clock: PCLK/2 = 8000000 Hz (CKMODE = 1), inside 140000..35000000 Hz.
 * main.c calls adc_control_init() after its own set-up and adc_control_poll() in its loop.
 */
#ifndef ADC_CONTROL_H
#define ADC_CONTROL_H
#include <stdint.h>
#include "stm32g031_regs.h"

#define ADC_BASE 0x40012400u
#define ADC_ISR REG32(ADC_BASE + 0x00u)
#define ADC_CR REG32(ADC_BASE + 0x08u)
#define ADC_CFGR2 REG32(ADC_BASE + 0x10u)
#define ADC_SMPR REG32(ADC_BASE + 0x14u)
#define ADC_CHSELR REG32(ADC_BASE + 0x28u)
#define ADC_DR REG32(ADC_BASE + 0x40u)
#define RCC_APBENR2 REG32(RCC_BASE + 0x40u)
#define ADC_ISR_ADRDY (1u << 0)
#define ADC_ISR_EOC (1u << 2)
#define ADC_ISR_CCRDY (1u << 13)
#define ADC_CR_ADEN (1u << 0)
#define ADC_CR_ADSTART (1u << 2)
#define ADC_CR_ADVREGEN (1u << 28)
#define ADC_CR_ADCAL (1u << 31)

#define ADJ_STEPS 64u
#define ADJ_COUNTS_PER_STEP 64u
#define ADJ_HYSTERESIS 2u

/* ARR (period counts - 1) and CCR1 (high counts) per step. */
static const uint16_t adj_arr[ADJ_STEPS] = {
  5988u, /* minimum */
  7643u,
  9297u,
  10952u,
  12607u,
  14262u,
  15916u,
  17571u,
  19226u,
  20881u,
  22535u,
  24190u,
  25845u,
  27500u,
  29154u,
  30809u,
  32464u,
  34119u,
  35773u,
  37428u,
  39083u,
  40738u,
  42392u,
  44047u,
  45702u,
  47357u,
  49011u,
  50666u,
  52321u,
  53976u,
  55630u,
  57285u,
  58940u,
  60595u,
  62249u,
  63904u,
  65559u,
  67214u,
  68868u,
  70523u,
  72178u,
  73833u,
  75487u,
  77142u,
  78797u,
  80452u,
  82106u,
  83761u,
  85416u,
  87071u,
  88725u,
  90380u,
  92035u,
  93690u,
  95344u,
  96999u,
  98654u,
  100309u,
  101963u,
  103618u,
  105273u,
  106928u,
  108582u,
  110237u, /* maximum */
};
static const uint16_t adj_ccr[ADJ_STEPS] = {
  3549u,
  4376u,
  5204u,
  6031u,
  6858u,
  7686u,
  8513u,
  9341u,
  10168u,
  10995u,
  11823u,
  12650u,
  13477u,
  14305u,
  15132u,
  15960u,
  16787u,
  17614u,
  18442u,
  19269u,
  20096u,
  20924u,
  21751u,
  22579u,
  23406u,
  24233u,
  25061u,
  25888u,
  26715u,
  27543u,
  28370u,
  29198u,
  30025u,
  30852u,
  31680u,
  32507u,
  33334u,
  34162u,
  34989u,
  35817u,
  36644u,
  37471u,
  38299u,
  39126u,
  39953u,
  40781u,
  41608u,
  42436u,
  43263u,
  44090u,
  44918u,
  45745u,
  46572u,
  47400u,
  48227u,
  49055u,
  49882u,
  50709u,
  51537u,
  52364u,
  53191u,
  54019u,
  54846u,
  55674u,
};
static uint32_t adj_now;

static uint32_t adj_read(void)
{
  ADC_CR |= ADC_CR_ADSTART;
  while ((ADC_ISR & ADC_ISR_EOC) == 0u) {
  }
  return ADC_DR & 0xFFFu; /* reading DR clears EOC */
}

/* Keeps the present step while the reading stays within ADJ_HYSTERESIS counts of its edges. */
static uint32_t adj_step(uint32_t count, uint32_t current)
{
  uint32_t lo = current * ADJ_COUNTS_PER_STEP;
  uint32_t hi = lo + ADJ_COUNTS_PER_STEP - 1u;
  if (count + ADJ_HYSTERESIS >= lo && count <= hi + ADJ_HYSTERESIS) {
    return current;
  }
  return count / ADJ_COUNTS_PER_STEP;
}

static void adj_apply(uint32_t s)
{
  TIM2->ARR = adj_arr[s];
  TIM2->CCR1 = adj_ccr[s];
  adj_now = s;
}

static void adc_control_init(void)
{
  RCC_APBENR2 |= (1u << 20); /* ADCEN */
  /* PA4 in analog mode (MODER = 11) */
  GPIOA->MODER |= (3u << 8);
  /* Clock mode while the ADC is off (ADEN = 0), as the ADC chapter asks. */
  ADC_CFGR2 = (1u << 30);
  /* Voltage regulator on, then its start-up time tADCVREG_STUP (20 us, datasheet; from memory):
   * 320 loops of at least 1 cycle at 16000000 Hz. */
  ADC_CR = ADC_CR_ADVREGEN;
  for (volatile uint32_t i = 0u; i < 320u; i++) {
  }
  /* Calibration with the ADC off; ADCAL clears when it is done. */
  ADC_CR |= ADC_CR_ADCAL;
  while ((ADC_CR & ADC_CR_ADCAL) != 0u) {
  }
  /* The longest sampling time (SMP1 = 111: 160.5 ADC clocks) for the pot's source impedance. */
  ADC_SMPR = 7u;
  ADC_CHSELR = (1u << 4); /* ADC_IN4 */
  while ((ADC_ISR & ADC_ISR_CCRDY) == 0u) {
  }
  ADC_ISR = ADC_ISR_ADRDY; /* clear by writing 1 */
  ADC_CR |= ADC_CR_ADEN;
  while ((ADC_ISR & ADC_ISR_ADRDY) == 0u) {
  }
  /* The table's prescaler (its longest step in hardware PWM), which main.c's fixed plan may not share. */
  TIM2->PSC = 0u;
  uint32_t c = adj_read();
  adj_apply(adj_step(c, c / ADJ_COUNTS_PER_STEP));
  TIM2->EGR = 1u; /* UG: load PSC, ARR and CCR1 now */
}

static void adc_control_poll(void)
{
  uint32_t s = adj_step(adj_read(), adj_now);
  if (s != adj_now) {
    adj_apply(s);
  }
}

#endif
