/* RP2040: the old stage's rate potentiometer kept on ADC0 (GPIO26).
 * Control: pot as rb, 47000 ohm track, linear + 2200 ohm in series; 64 steps of 64 counts of the 12-bit ADC,
 * hysteresis 2 counts. PWM slice 0 channel A: only TOP and CC
 * change per step; both are double buffered and take effect at the counter wrap.
 * Register addresses and fields: RP2040 datasheet, ADC section 4.9 (CS: EN, START_ONCE,
 * READY, AINSEL; RESULT), clocks (CLK_ADC_CTRL), RESETS, PADS_BANK0, PWM.
 * main.c calls adc_control_init() after its own set-up and adc_control_poll() in its loop.
 */
#ifndef ADC_CONTROL_H
#define ADC_CONTROL_H
#include <stdint.h>
#include "rp2040_regs.h"

#define ADC_BASE 0x4004C000u
#define ADC_CS REG32(ADC_BASE + 0x00u)
#define ADC_RESULT REG32(ADC_BASE + 0x04u)
#define ADC_CS_EN (1u << 0)
#define ADC_CS_START_ONCE (1u << 2)
#define ADC_CS_READY (1u << 8)
#define RESETS_ADC (1u << 0)
#define CLK_ADC_CTRL REG32(CLOCKS_BASE + 0x60u)
#define PLL_USB_BASE 0x4002C000u
#define PLL_USB_CS REG32(PLL_USB_BASE + 0x0u)
#define PLL_USB_PWR REG32(PLL_USB_BASE + 0x4u)
#define PLL_USB_FBDIV_INT REG32(PLL_USB_BASE + 0x8u)
#define PLL_USB_PRIM REG32(PLL_USB_BASE + 0xCu)
#define RESETS_PLL_USB (1u << 13)

#define ADJ_STEPS 64u
#define ADJ_COUNTS_PER_STEP 64u
#define ADJ_HYSTERESIS 2u
#define ADJ_SLICE 0u

/* TOP (period counts - 1) and CC (high counts) per step. */
static const uint16_t adj_top[ADJ_STEPS] = {
  105u, /* minimum */
  134u,
  164u,
  193u,
  222u,
  252u,
  281u,
  310u,
  340u,
  369u,
  398u,
  428u,
  457u,
  486u,
  516u,
  545u,
  574u,
  604u,
  633u,
  662u,
  692u,
  721u,
  750u,
  780u,
  809u,
  838u,
  868u,
  897u,
  926u,
  956u,
  985u,
  1014u,
  1044u,
  1073u,
  1102u,
  1132u,
  1161u,
  1190u,
  1220u,
  1249u,
  1278u,
  1308u,
  1337u,
  1366u,
  1396u,
  1425u,
  1454u,
  1484u,
  1513u,
  1542u,
  1572u,
  1601u,
  1630u,
  1660u,
  1689u,
  1718u,
  1748u,
  1777u,
  1806u,
  1836u,
  1865u,
  1894u,
  1924u,
  1953u, /* maximum */
};
static const uint16_t adj_cc[ADJ_STEPS] = {
  63u,
  78u,
  92u,
  107u,
  122u,
  136u,
  151u,
  166u,
  180u,
  195u,
  210u,
  224u,
  239u,
  254u,
  268u,
  283u,
  298u,
  312u,
  327u,
  342u,
  356u,
  371u,
  386u,
  400u,
  415u,
  430u,
  444u,
  459u,
  474u,
  488u,
  503u,
  518u,
  532u,
  547u,
  562u,
  576u,
  591u,
  606u,
  620u,
  635u,
  650u,
  664u,
  679u,
  694u,
  708u,
  723u,
  738u,
  752u,
  767u,
  782u,
  796u,
  811u,
  826u,
  840u,
  855u,
  870u,
  884u,
  899u,
  914u,
  928u,
  943u,
  957u,
  972u,
  987u,
};

static uint32_t adj_now;

static uint32_t adj_read(void)
{
  ADC_CS = ADC_CS_EN | (0u << 12) | ADC_CS_START_ONCE; /* AINSEL = 0 */
  while ((ADC_CS & ADC_CS_READY) == 0u) {
  }
  return ADC_RESULT & 0xFFFu;
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
  PWM_CH_TOP(ADJ_SLICE) = adj_top[s];
  PWM_CH_CC(ADJ_SLICE) = (uint32_t)adj_cc[s];
  adj_now = s;
}

static void adc_control_init(void)
{
  /* The ADC wants a 48 MHz clk_adc (datasheet 4.9): PLL_USB from the 12 MHz crystal,
   * REFDIV 1, FBDIV 100 = VCO 1200 MHz (750..1600 MHz), POSTDIV1 5, POSTDIV2 5 = 48 MHz
   * (PLL section; these divider values from memory). */
  RESETS_RESET_CLR = RESETS_PLL_USB;
  while ((RESETS_RESET_DONE & RESETS_PLL_USB) == 0u) {
  }
  PLL_USB_CS = 1u;
  PLL_USB_FBDIV_INT = 100u;
  PLL_USB_PWR &= ~((1u << 0) | (1u << 5)); /* PD and VCOPD off */
  while ((PLL_USB_CS & (1u << 31)) == 0u) {
  } /* LOCK */
  PLL_USB_PRIM = (5u << 16) | (5u << 12);
  PLL_USB_PWR &= ~(1u << 3); /* POSTDIVPD off */
  /* clk_adc = clksrc_pll_usb (AUXSRC 0), ENABLE; then the ADC out of reset. */
  CLK_ADC_CTRL = (1u << 11) | (0u << 5);
  RESETS_RESET_CLR = RESETS_ADC;
  while ((RESETS_RESET_DONE & RESETS_ADC) == 0u) {
  }
  /* GPIO26 pad: input buffer off (IE = 0), output disabled (OD = 1), as the ADC section asks. */
  PADS_BANK0_GPIO(26) = (1u << 7);
  ADC_CS = ADC_CS_EN;
  while ((ADC_CS & ADC_CS_READY) == 0u) {
  }
  uint32_t c = adj_read();
  /* The table's divider (its longest step in hardware PWM), which main.c's fixed plan may not share. */
  PWM_CH_DIV(ADJ_SLICE) = (42u << 4) | 5u; /* DIV = 42.3125 */
  adj_apply(adj_step(c, c / ADJ_COUNTS_PER_STEP));
}

static void adc_control_poll(void)
{
  uint32_t s = adj_step(adj_read(), adj_now);
  if (s != adj_now) {
    adj_apply(s);
  }
}
#endif
