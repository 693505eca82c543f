/* STM32G031 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r3, engine 1.0.0; target 4 (stm32g031-4)
 * TIM3, mode pwm, clock 16.00000 MHz, output PA6 (TIM3_CH1, pin 13)
 * Period 1.000000 ms (+0.000 ppm), high 250.0000 us (+0.000 ppm)
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

int main(void)
{
  clock_init();
  RCC_IOPENR |= (1u << 0); /* GPIOAEN */
  RCC_APBENR1 |= (1u << 1); /* TIM3EN */

  /* PA6 as alternate function AF1 (TIM3_CH1) */
  GPIOA->AFR[0] = (GPIOA->AFR[0] & ~(15u << 24)) | (1u << 24);
  GPIOA->MODER = (GPIOA->MODER & ~(3u << 12)) | (2u << 12);

  /* PSC = divider - 1; counter clock = f_TIM/1 -> 0x00000000 */
  TIM3->PSC = 0;
  /* ARR = periodCounts - 1; update every (PSC+1)*(ARR+1)/f_TIM -> 0x00003E7F */
  TIM3->ARR = 15999;
  /* PWM mode 1: high while CNT < CCR1; high = CCR1*(PSC+1)/f_TIM -> 0x00000FA0 */
  TIM3->CCR1 = 4000;
  /* OC1M = 110 (PWM mode 1), OC1PE = 1 -> 0x00000068 */
  TIM3->CCMR1 = (6u << 4) | (1u << 3);
  /* CC1E = 1: output enabled, active high -> 0x00000001 */
  TIM3->CCER = 1u << 0;
  /* UG = 1: load PSC and ARR before the start -> 0x00000001 */
  TIM3->EGR = 1u << 0;
  /* ARPE = 1 (buffered ARR), CEN = 1: starts the counter -> 0x00000081 */
  TIM3->CR1 = (1u << 7) | (1u << 0);

  for (;;) {
    __asm__ volatile("wfi");
  }
}
