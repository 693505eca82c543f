/* STM32G031: the old stage's selector switch kept on input pins of GPIOA.
 * Control: selector on c; 3 positions, one input per position
 * (GPIOx_PUPDR = 01 pull-up, the switch's common contact to ground: the selected position reads low),
 * debounced over 20 samples 1 ms apart (SysTick on the core clock).
 * While no position or more than one reads low (the switch between contacts), the output keeps the last position's timing.
 * TIM2 channel 1: only ARR and CCR1 change per position; both preloaded (ARPE, OCxPE),
 * taken at the update event. Register fields: RM0444, GPIO (MODER 00 = input, PUPDR 01 = pull-up,
 * IDR), RCC IOPENR, general-purpose timers; Cortex-M0+ SysTick (SYST_CSR/RVR/CVR).
 * main.c calls selector_control_init() after its own set-up and selector_control_poll() in its loop.
 */
#ifndef SELECTOR_CONTROL_H
#define SELECTOR_CONTROL_H
#include <stdint.h>
#include "stm32g031_regs.h"

#define SYST_CSR REG32(0xE000E010u)
#define SYST_RVR REG32(0xE000E014u)
#define SYST_CVR REG32(0xE000E018u)
#define SEL_POSITIONS 3u
#define SEL_MASK 0x000000E0u
#define SEL_DEBOUNCE_MS 20u
#define SEL_NONE 0xFFu

/* GPIOA bit, ARR (period counts - 1) and CCR1 (high counts) per position. */
static const uint8_t sel_bit[SEL_POSITIONS] = {
  5u, /* position 1 */
  6u, /* position 2 */
  7u, /* position 3 */
};
static const uint32_t sel_arr[SEL_POSITIONS] = {
  10945u,
  23289u,
  51236u,
};
static const uint32_t sel_ccr[SEL_POSITIONS] = {
  5734u,
  12199u,
  26839u,
};

static uint32_t sel_now;

/* The position whose contact reads low; SEL_NONE when none or more than one does. */
static uint32_t sel_read(void)
{
  uint32_t low = ~GPIOA->IDR & SEL_MASK;
  uint32_t found = SEL_NONE;
  for (uint32_t i = 0; i < SEL_POSITIONS; i++) {
    if (low & (1u << sel_bit[i])) {
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
  TIM2->ARR = sel_arr[i];
  TIM2->CCR1 = sel_ccr[i];
  sel_now = i;
}

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
  RCC_IOPENR |= 1u; /* GPIOAEN */
  /* Inputs: MODER = 00 (input), PUPDR = 01 (pull-up) on each contact pin. */
  GPIOA->MODER &= ~0x0000FC00u;
  GPIOA->PUPDR = (GPIOA->PUPDR & ~0x0000FC00u) | 0x00005400u;
  SYST_RVR = SYSCLK_HZ / 1000u - 1u;
  SYST_CVR = 0u;
  SYST_CSR = (1u << 2) | 1u; /* CLKSOURCE = processor clock, ENABLE */
  /* The table's prescaler (its longest position), which main.c's fixed plan may not share. */
  TIM2->PSC = 0u;
  uint32_t first = sel_debounced();
  sel_apply(first == SEL_NONE ? 1u : first); /* no contact: the stored value's position */
  TIM2->EGR = 1u; /* UG: load PSC, ARR and CCR1 now */
}

static void selector_control_poll(void)
{
  uint32_t s = sel_debounced();
  if (s != SEL_NONE && s != sel_now) {
    sel_apply(s);
  }
}
#endif
