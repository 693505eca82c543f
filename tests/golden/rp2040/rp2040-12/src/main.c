/* RP2040 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r3, engine 1.0.0; target 12 (rp2040-12)
 * PWM5, mode isr, clock 125.0000 MHz, output GPIO10 (GPIO, pin 13)
 * Period 1.000000 s (+0.000 ppm), high 250.0000 ms (+0.000 ppm)
 * Register values: RP2040 datasheet, PWM, clocks, XOSC, PLL, RESETS and IO_BANK0 sections.
 * Boot: src/boot2.S (our stage 2) sets up XIP and VTOR, then Reset_Handler in src/startup.c runs main.
 */
#include <stdint.h>
#include "rp2040_regs.h"
#include "timing.h"

static void clock_init(void)
{
  /* XOSC, 12 MHz crystal: FREQ_RANGE = 1_15MHZ (0xAA0); STARTUP DELAY in
   * units of 256 crystal periods: 1 ms = 12 MHz / 1000 / 256 rounded up = 47
   * (RP2040 datasheet, XOSC start-up delay), times 64 as margin for slow
   * crystals = 3008 (about 64 ms). */
  XOSC_CTRL = 0xAA0u;
  XOSC_STARTUP = 3008u;
  XOSC_CTRL = 0xAA0u | (0xFABu << 12); /* ENABLE */
  while ((XOSC_STATUS & (1u << 31)) == 0u) {
  } /* STABLE */
  CLK_REF_CTRL = 2u; /* clk_ref = xosc_clksrc */
  while ((CLK_REF_SELECTED & (1u << 2)) == 0u) {
  }
  CLK_SYS_CTRL = 0u; /* clk_sys = clk_ref (the crystal) */
  while ((CLK_SYS_SELECTED & 1u) == 0u) {
  }
  /* PLL_SYS (RP2040 datasheet, PLL): f = 12 MHz / REFDIV 1 * FBDIV 125 = VCO 1.500000 GHz
   * (750..1600 MHz), / POSTDIV1 6 / POSTDIV2 2 = 125.0000 MHz. */
  RESETS_RESET_CLR = RESETS_PLL_SYS;
  while ((RESETS_RESET_DONE & RESETS_PLL_SYS) == 0u) {
  }
  PLL_SYS_CS = 1u; /* REFDIV */
  PLL_SYS_FBDIV_INT = 125u;
  PLL_SYS_PWR &= ~((1u << 0) | (1u << 5)); /* PD and VCOPD off: VCO runs */
  while ((PLL_SYS_CS & (1u << 31)) == 0u) {
  } /* LOCK */
  PLL_SYS_PRIM = (6u << 16) | (2u << 12);
  PLL_SYS_PWR &= ~(1u << 3); /* POSTDIVPD off */
  CLK_SYS_CTRL = (0u << 5); /* AUXSRC = clksrc_pll_sys, changed while SRC is still clk_ref */
  CLK_SYS_CTRL = (0u << 5) | 1u; /* SRC = clksrc_clk_sys_aux (glitchless switch) */
  while ((CLK_SYS_SELECTED & 2u) == 0u) {
  }
}

/* Software divider: each interrupt first writes the level computed for the
 * interval it starts, so both edges see the same entry latency. */
static volatile uint32_t tick;
static volatile uint32_t level_next = (0u < TIMING_HIGH_TICKS);

void PWM_IRQ_WRAP_Handler(void)
{
  if (level_next) {
    SIO_GPIO_OUT_SET = 1u << TIMING_GPIO;
  } else {
    SIO_GPIO_OUT_CLR = 1u << TIMING_GPIO;
  }
  PWM_INTR = 1u << TIMING_SLICE; /* clear the wrap flag */
  uint32_t t = tick + 1u;
  if (t >= TIMING_SOFT_DIVIDER) {
    t = 0u;
  }
  tick = t;
  level_next = (t < TIMING_HIGH_TICKS);
}

int main(void)
{
  clock_init();
  RESETS_RESET_CLR = RESETS_IO_BANK0 | RESETS_PADS_BANK0 | RESETS_PWM;
  while ((RESETS_RESET_DONE & (RESETS_IO_BANK0 | RESETS_PADS_BANK0 | RESETS_PWM)) != (RESETS_IO_BANK0 | RESETS_PADS_BANK0 | RESETS_PWM)) {
  }

  /* GPIO10 as SIO output (FUNCSEL 5) */
  IO_BANK0_GPIO_CTRL(TIMING_GPIO) = 5u;
  SIO_GPIO_OE_SET = 1u << TIMING_GPIO;

  /* DIV_INT.DIV_FRAC = 250 + 0/16 = 250 -> 0x00000FA0 */
  PWM_CH_DIV(TIMING_SLICE) = (250u << 4) | 0u;
  /* TOP = periodCounts - 1; period = (TOP+1)*(PH_CORRECT+1)*DIV/f_sys -> 0x0000F423 */
  PWM_CH_TOP(TIMING_SLICE) = 62499;
  /* wrap interrupt of slice 5 on -> 0x00000020 */
  PWM_INTE = 1u << 5;
  /* EN = 1, PH_CORRECT = 0 -> 0x00000001 */
  PWM_CH_CSR(TIMING_SLICE) = 1u;
  NVIC_ISER = 1u << PWM_IRQ_WRAP;

  for (;;) {
    __asm__ volatile("wfi");
  }
}
