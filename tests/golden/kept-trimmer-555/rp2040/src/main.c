/* RP2040 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r1, engine 1.0.0; target 3 (rp2040)
 * PWM0, mode pwm, clock 12.00000 MHz, output GPIO0 (PWM0_A, pin 2)
 * Period 1.455599 ms (-0.716 ppm), high 762.3698 us (-39.623 ppm)
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
  /* clk_sys stays on the crystal: 12.00000 MHz, PLL_SYS unused. */
}

int main(void)
{
  clock_init();
  RESETS_RESET_CLR = RESETS_IO_BANK0 | RESETS_PADS_BANK0 | RESETS_PWM;
  while ((RESETS_RESET_DONE & (RESETS_IO_BANK0 | RESETS_PADS_BANK0 | RESETS_PWM)) != (RESETS_IO_BANK0 | RESETS_PADS_BANK0 | RESETS_PWM)) {
  }

  /* GPIO0 = PWM slice 0 channel A (FUNCSEL 4) */
  IO_BANK0_GPIO_CTRL(TIMING_GPIO) = 4u;

  /* DIV_INT.DIV_FRAC = 1 + 9/16 = 1.5625 -> 0x00000019 */
  PWM_CH_DIV(TIMING_SLICE) = (1u << 4) | 9u;
  /* TOP = periodCounts - 1; period = (TOP+1)*(PH_CORRECT+1)*DIV/f_sys (the calibration constant) -> 0x00002BAA */
  PWM_CH_TOP(TIMING_SLICE) = (TRIM_PERIOD_COUNTS - 1u);
  /* channel A: high while counter < CC; 5855 counts (follows the calibration constant) -> 0x000016DF */
  PWM_CH_CC(TIMING_SLICE) = TRIM_HIGH_COUNTS;
  /* EN = 1, PH_CORRECT = 0 -> 0x00000001 */
  PWM_CH_CSR(TIMING_SLICE) = 1u;

  for (;;) {
    __asm__ volatile("wfi");
  }
}
