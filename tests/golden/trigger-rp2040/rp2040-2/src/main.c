/* RP2040 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r1, engine 1.0.0; target 2 (rp2040-2)
 * PWM0, mode isr, clock 12.00000 MHz, output GPIO0 (PWM0_A, pin 2)
 * Period 20.00000 ms (+0.000 ppm), high 1.000000 ms (+0.000 ppm)
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

/* Triggered one-shot: input GPIO15 (GPIO edge interrupt (IO_IRQ_BANK0), pin 18), falling edge: PROC0_INTE EDGE_LOW
 * Output GPIO0 (pin 2) driven by PWM slice 0 channel A (FUNCSEL 4):
 * clk_sys/1, pulse on at count 48000 (4.000000 ms), off at the wrap after
 * count 59999 (pulse 1.000000 ms); the slice stops at the wrap until the next edge.
 * Worst-case edge-to-count latency 28 cycles (2.333333 us): GPIO input synchroniser 2 cycles (RP2040 datasheet, GPIO; from memory) + Cortex-M0+ exception entry 15 cycles (Cortex-M0+ Technical Reference Manual, interrupt latency with zero-wait-state memory: vector table and handler run from SRAM) + 1 to finish the busy loop's branch; edge handler (templates/rp2040/trigger.c.hbs, naked) 5 cycles to the PWM CSR.EN store (ldr 2, movs 1, str 2; ARMv6-M cycle counts), restart rule 10 to the CTR = 0 store; the PWM slice then drives the pin itself, so the pulse has no handler in its path
 * The two handlers and the vector table they are reached through run from SRAM,
 * so no flash (XIP cache) fetch adds to the latency; the handlers are naked
 * Thumb assembly so their cycle counts are fixed.
 * Registers: RP2040 datasheet, PWM (CSR EN/A_INV, CTR, CC, TOP, INTR, INTE),
 * GPIO (IO_BANK0 INTR1, PROC0_INTE1; PADS_BANK0), atomic set/clear aliases. */
#define TRIG_VTOR REG32(0xE000ED08u)

extern void (*const vector_table[16 + 32])(void);
static void (*ram_vectors[16 + 32])(void) __attribute__((aligned(256)));

/* Input edge. Restart rule: start the slice (5 cycles to the CSR store), count
 * back to 0 (10 cycles), take the latched edge. */
__attribute__((naked, section(".data.ramcode"))) void trig_edge_isr(void)
{
  __asm__ volatile(
      "ldr r0, =%c[csr_set]\n\t"
      "movs r1, #1\n\t"
      "str r1, [r0]\n\t"
      "ldr r0, =%c[ctr]\n\t"
      "movs r1, #0\n\t"
      "str r1, [r0]\n\t"
      "ldr r0, =%c[intr]\n\t"
      "ldr r1, =%c[mask]\n\t"
      "str r1, [r0]\n\t"
      "bx lr\n\t"
      ".ltorg\n\t"
      :
      : [csr_set] "i"(0x40052000u), [ctr] "i"(0x40050008u), [inte_clr] "i"(0x40017104u),
        [intr] "i"(0x400140F4u), [mask] "i"(0x40000000u));
}

/* Wrap after count 59999: the slice has taken the pulse off; stop it, count back to 0,
 * clear the wrap flag. */
__attribute__((naked, section(".data.ramcode"))) void trig_wrap_isr(void)
{
  __asm__ volatile(
      "ldr r0, =%c[csr_clr]\n\t"
      "movs r1, #1\n\t"
      "str r1, [r0]\n\t"
      "ldr r0, =%c[ctr]\n\t"
      "movs r1, #0\n\t"
      "str r1, [r0]\n\t"
      "ldr r0, =%c[pwm_intr]\n\t"
      "movs r1, #%c[slice_bit]\n\t"
      "str r1, [r0]\n\t"
      "bx lr\n\t"
      ".ltorg\n\t"
      :
      : [csr_clr] "i"(0x40053000u), [ctr] "i"(0x40050008u), [pwm_intr] "i"(PWM_BASE + 0xA4u),
        [slice_bit] "i"(1u << 0), [intr] "i"(0x400140F4u), [inte_set] "i"(0x40016104u),
        [mask] "i"(0x40000000u));
}

int main(void)
{
  clock_init();
  RESETS_RESET_CLR = RESETS_IO_BANK0 | RESETS_PADS_BANK0 | RESETS_PWM;
  while ((RESETS_RESET_DONE & (RESETS_IO_BANK0 | RESETS_PADS_BANK0 | RESETS_PWM)) != (RESETS_IO_BANK0 | RESETS_PADS_BANK0 | RESETS_PWM)) {
  }

  /* Vector table in SRAM (VTOR, ARMv6-M Architecture Reference Manual, System Control Block). */
  for (uint32_t i = 0u; i < 16u + 32u; i++) {
    ram_vectors[i] = vector_table[i];
  }
  ram_vectors[16u + PWM_IRQ_WRAP] = trig_wrap_isr;
  ram_vectors[16u + 13u] = trig_edge_isr; /* IO_IRQ_BANK0 */
  TRIG_VTOR = (uint32_t)ram_vectors;

  /* Slice 0 stopped at count 0: DIV_INT 1, CC(A) = 48000, TOP = 59999, A_INV: output low while counter < CC. */
  PWM_CH_CSR(0) = 4u;
  PWM_CH_DIV(0) = 1u << 4;
  PWM_CH_CTR(0) = 0u;
  PWM_CH_CC(0) = 48000u;
  PWM_CH_TOP(0) = 59999u;
  PWM_INTR = 1u << 0;
  PWM_INTE = 1u << 0;
  IO_BANK0_GPIO_CTRL(0) = 4u; /* PWM */

  /* Input GPIO15: SIO (never driven), pad IE + pull-up + Schmitt trigger, 4 mA (0x5A). */
  IO_BANK0_GPIO_CTRL(15) = 5u;
  PADS_BANK0_GPIO(15) = 0x5Au;
  REG32(0x400140F4u) = 0x40000000u; /* drop edges seen before now */
  /* PROC0_INTE EDGE_LOW */
  REG32(0x40016104u) = 0x40000000u;
  NVIC_ISER = (1u << PWM_IRQ_WRAP) | (1u << 13u);

  /* Busy loop (one branch) rather than wfi, so waking adds nothing to the latency. */
  for (;;) {
  }
}
