/* STM32G031 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r1, engine 1.0.0; target 4 (stm32g031)
 * TIM2, mode pwm, clock 16.00000 MHz, output PA0 (TIM2_CH1, pin 7)
 * Period 1.455625 ms (+17.175 ppm), high 762.3750 us (-32.791 ppm)
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
  RCC_APBENR1 |= (1u << 0); /* TIM2EN */

  /* PA0 as alternate function AF2 (TIM2_CH1) */
  GPIOA->AFR[0] = (GPIOA->AFR[0] & ~(15u << 0)) | (2u << 0);
  GPIOA->MODER = (GPIOA->MODER & ~(3u << 0)) | (2u << 0);

  /* PSC = divider - 1; counter clock = f_TIM/1 -> 0x00000000 */
  TIM2->PSC = 0;
  /* ARR = periodCounts - 1; update every (PSC+1)*(ARR+1)/f_TIM (the calibration constant) -> 0x00005AF9 */
  TIM2->ARR = (TRIM_PERIOD_COUNTS - 1u);
  /* PWM mode 1: high while CNT < CCR1; high = CCR1*(PSC+1)/f_TIM (follows the calibration constant) -> 0x00002FA6 */
  TIM2->CCR1 = TRIM_HIGH_COUNTS;
  /* OC1M = 110 (PWM mode 1), OC1PE = 1 -> 0x00000068 */
  TIM2->CCMR1 = (6u << 4) | (1u << 3);
  /* CC1E = 1: output enabled, active high -> 0x00000001 */
  TIM2->CCER = 1u << 0;
  /* UG = 1: load PSC and ARR before the start -> 0x00000001 */
  TIM2->EGR = 1u << 0;
  /* ARPE = 1 (buffered ARR), CEN = 1: starts the counter -> 0x00000081 */
  TIM2->CR1 = (1u << 7) | (1u << 0);

  for (;;) {
    __asm__ volatile("wfi");
  }
}
