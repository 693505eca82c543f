/* RP2040: the old stage's selector switch kept on input pins.
 * Control: selector on c; 3 positions, one input per position
 * (pad pull-up on, the switch's common contact to ground: the selected position reads low),
 * debounced over 20 samples 1 ms apart (SysTick on clk_sys).
 * While no position or more than one reads low (the switch between contacts), the output keeps the last position's timing.
 * PWM slice 0 channel A: only TOP and CC change per position; both are
 * double buffered and take effect at the counter wrap.
 * Register fields: RP2040 datasheet, PADS_BANK0 GPIOx (IE bit 6, PUE bit 3, PDE bit 2, SCHMITT bit 1),
 * IO_BANK0 GPIOx_CTRL (FUNCSEL 5 = SIO), SIO GPIO_IN, Cortex-M0+ SysTick (SYST_CSR/RVR/CVR), PWM.
 * main.c calls selector_control_init() after its own set-up and selector_control_poll() in its loop.
 */
#ifndef SELECTOR_CONTROL_H
#define SELECTOR_CONTROL_H
#include <stdint.h>
#include "rp2040_regs.h"

#define SIO_GPIO_IN REG32(SIO_BASE + 0x04u)
#define SYST_CSR REG32(0xE000E010u)
#define SYST_RVR REG32(0xE000E014u)
#define SYST_CVR REG32(0xE000E018u)
#define SEL_POSITIONS 3u
#define SEL_MASK 0x1Cu
#define SEL_DEBOUNCE_MS 20u
#define SEL_NONE 0xFFu
#define SEL_SLICE 0u

/* GPIO, TOP (period counts - 1) and CC (high counts) per position. */
static const uint8_t sel_gpio[SEL_POSITIONS] = {
  2u, /* position 1 */
  3u, /* position 2 */
  4u, /* position 3 */
};
static const uint16_t sel_top[SEL_POSITIONS] = {
  5253u,
  11178u,
  24593u,
};
static const uint16_t sel_cc[SEL_POSITIONS] = {
  2752u,
  5856u,
  12883u,
};

static uint32_t sel_now;

/* The position whose contact reads low; SEL_NONE when none or more than one does. */
static uint32_t sel_read(void)
{
  uint32_t low = ~SIO_GPIO_IN & SEL_MASK;
  uint32_t found = SEL_NONE;
  for (uint32_t i = 0; i < SEL_POSITIONS; i++) {
    if (low & (1u << sel_gpio[i])) {
      if (found != SEL_NONE) {
        return SEL_NONE;
      }
      found = i;
    }
  }
  return found;
}

static void sel_apply(uint32_t i)
{
  PWM_CH_TOP(SEL_SLICE) = sel_top[i];
  PWM_CH_CC(SEL_SLICE) = (uint32_t)sel_cc[i];
  sel_now = i;
}

/* 1 ms on SysTick: reload clk_sys / 1000 - 1, processor clock, COUNTFLAG (bit 16) at each wrap. */
static void sel_wait_ms(void)
{
  SYST_CVR = 0u;
  while ((SYST_CSR & (1u << 16)) == 0u) {
  }
}

/* One reading that stayed the same for SEL_DEBOUNCE_MS samples 1 ms apart. */
static uint32_t sel_debounced(void)
{
  uint32_t seen = sel_read();
  uint32_t same = 0u;
  while (same < SEL_DEBOUNCE_MS) {
    sel_wait_ms();
    uint32_t now = sel_read();
    if (now == seen) {
      same++;
    } else {
      seen = now;
      same = 0u;
    }
  }
  return seen;
}

static void selector_control_init(void)
{
  /* Inputs: pad IE = 1, PUE = 1, PDE = 0, SCHMITT = 1; FUNCSEL = SIO with the output off. */
  for (uint32_t i = 0; i < SEL_POSITIONS; i++) {
    PADS_BANK0_GPIO(sel_gpio[i]) = (1u << 6) | (1u << 3) | (1u << 1);
    IO_BANK0_GPIO_CTRL(sel_gpio[i]) = 5u;
  }
  SYST_RVR = CLK_SYS_HZ / 1000u - 1u;
  SYST_CVR = 0u;
  SYST_CSR = (1u << 2) | 1u; /* CLKSOURCE = processor clock, ENABLE */
  /* The table's divider (its longest position in hardware PWM), which main.c's fixed plan may not share. */
  PWM_CH_DIV(SEL_SLICE) = (1u << 4) | 9u; /* DIV = 1.5625 */
  uint32_t first = sel_debounced();
  sel_apply(first == SEL_NONE ? 1u : first); /* no contact: the stored value's position */
}

static void selector_control_poll(void)
{
  uint32_t s = sel_debounced();
  if (s != SEL_NONE && s != sel_now) {
    sel_apply(s);
  }
}
#endif
