/* RP2040 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r1, engine 1.0.0; target 2 (rp2040)
 * PWM0, mode pwm, clock 125.0000 MHz, output GPIO0 (PWM0_A, pin 2)
 * Period 20.00000 ms (+0.000 ppm), high 1.499840 ms (-106.667 ppm)
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

int main(void)
{
  clock_init();
  RESETS_RESET_CLR = RESETS_IO_BANK0 | RESETS_PADS_BANK0 | RESETS_PWM;
  while ((RESETS_RESET_DONE & (RESETS_IO_BANK0 | RESETS_PADS_BANK0 | RESETS_PWM)) != (RESETS_IO_BANK0 | RESETS_PADS_BANK0 | RESETS_PWM)) {
  }

  /* GPIO0 = PWM slice 0 channel A (FUNCSEL 4) */
  IO_BANK0_GPIO_CTRL(TIMING_GPIO) = 4u;

  /* DIV_INT.DIV_FRAC = 20 + 0/16 = 20 -> 0x00000140 */
  PWM_CH_DIV(TIMING_SLICE) = (20u << 4) | 0u;
  /* TOP = periodCounts - 1; period = (TOP+1)*(PH_CORRECT+1)*DIV/f_sys -> 0x0000F423 */
  PWM_CH_TOP(TIMING_SLICE) = 62499;
  /* channel A: high while counter < CC; 4687 counts -> 0x0000124F */
  PWM_CH_CC(TIMING_SLICE) = 4687u;
  /* EN = 1, PH_CORRECT = 1 -> 0x00000003 */
  PWM_CH_CSR(TIMING_SLICE) = (1u << 1) | 1u;

  for (;;) {
    __asm__ volatile("wfi");
  }
}
