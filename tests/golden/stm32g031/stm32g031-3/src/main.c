/* STM32G031 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r3, engine 1.0.0; target 3 (stm32g031-3)
 * TIM2, mode isr, clock 16.00000 MHz, output PA0 (GPIO, pin 7)
 * Period 1.000000 s (+0.000 ppm), high 250.0000 ms (+0.000 ppm)
 * Part STM32G031F8P6 (TSSOP-20), clock source hsi16
 * Register values: RM0444 reference manual.
 */
#include <stdint.h>
#include "stm32g031_regs.h"
#include "timing.h"

static void clock_init(void)
{
  /* SYSCLK = HSISYS = HSI16 / 2^HSIDIV = 16 MHz / 1 = 16.00000 MHz.
   * HSI16 runs from reset; HSIDIV = 0 (RCC_CR bits 13:11). At most 16 MHz: 0 flash wait states. */
  FLASH_ACR = (FLASH_ACR & ~7u) | 0u; /* LATENCY */
  RCC_CR = (RCC_CR & ~(7u << 11)) | (0u << 11); /* HSIDIV */
}

/* Software divider: each interrupt first writes the level computed for the
 * interval it starts, so both edges see the same entry latency. */
static volatile uint32_t tick;
static volatile uint32_t level_next = (0u < TIMING_HIGH_TICKS);

void TIM2_IRQHandler(void)
{
  GPIOA->BSRR = level_next ? (1u << 0) : (1u << (0 + 16));
  TIM2->SR = 0u; /* clear UIF */
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
  RCC_IOPENR |= (1u << 0); /* GPIOAEN */
  RCC_APBENR1 |= (1u << 0); /* TIM2EN */

  /* PA0 as push-pull output (MODER = 01) */
  GPIOA->MODER = (GPIOA->MODER & ~(3u << 0)) | (1u << 0);

  /* PSC = divider - 1; counter clock = f_TIM/1 -> 0x00000000 */
  TIM2->PSC = 0;
  /* ARR = periodCounts - 1; update every (PSC+1)*(ARR+1)/f_TIM -> 0x003D08FF */
  TIM2->ARR = 3999999;
  /* UIE = 1: update interrupt on -> 0x00000001 */
  TIM2->DIER = 1u << 0;
  /* UG = 1: load PSC and ARR before the start -> 0x00000001 */
  TIM2->EGR = 1u << 0;
  /* ARPE = 1 (buffered ARR), CEN = 1: starts the counter -> 0x00000081 */
  TIM2->CR1 = (1u << 7) | (1u << 0);
  TIM2->SR = 0u; /* the UG write set UIF */
  NVIC_ISER = (1u << 15); /* TIM2 interrupt */

  for (;;) {
    __asm__ volatile("wfi");
  }
}
