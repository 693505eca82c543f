/* STM32G031 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r1, engine 1.0.0; target 1 (stm32g031)
 * TIM2, mode isr, clock 16.00000 MHz, output PA0 (TIM2_CH1, pin 7)
 * Period 10.00000 ms (+0.000 ppm), high 100.0000 us (+0.000 ppm)
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

/* Mains zero-cross start: input PA1 (EXTI1, pin 8), both edge: EXTI_RTSR1 and EXTI_FTSR1 bit 1
 * Output PA0 (TIM2_CH1, AF2, pin 7): TIM2 one-pulse mode, counter clock
 * f/1, channel 1 PWM mode 2: pulse on at count 64000 (4.000000 ms), off after count
 * 65599 (pulse 100.0000 us); the update at the end of the run stops the counter (OPM).
 * Worst-case edge-to-count latency 31 cycles (1.937500 us): EXTI input synchroniser 3 cycles (from memory) + Cortex-M0+ exception entry 15 cycles (Cortex-M0+ Technical Reference Manual, interrupt latency with zero-wait-state memory: vector table and handler run from SRAM) + up to 3 to finish the busy loop's branch in flash (1 + 2 wait states, RM0444 FLASH_ACR LATENCY); EXTI handler (templates/stm32g031/trigger.c.hbs, naked) 5 cycles to the TIMx_CR1 CEN store (ldr 2, movs 1, str 2; ARMv6-M cycle counts), restart rule 10 (EGR UG first); the timer's one-pulse mode drives the pin itself, so the pulse has no handler in its path
 * The handler and the vector table it is reached through run from SRAM, so
 * flash wait states do not add to the latency; the handler is naked Thumb
 * assembly so its cycle count is fixed.
 * Registers: RM0444, EXTI (RTSR1, FTSR1, RPR1, FPR1, EXTICR1, IMR1) and general-purpose timer chapters. */
#define TRIG_VTOR REG32(0xE000ED08u)
#define EXTI_BASE 0x40021800u
#define EXTI_RTSR1 REG32(EXTI_BASE + 0x00u)
#define EXTI_FTSR1 REG32(EXTI_BASE + 0x04u)
#define EXTI_RPR1 REG32(EXTI_BASE + 0x0Cu)
#define EXTI_FPR1 REG32(EXTI_BASE + 0x10u)
#define EXTI_EXTICR1 REG32(EXTI_BASE + 0x60u)
#define EXTI_IMR1 REG32(EXTI_BASE + 0x80u)

extern void (*const vector_table[16 + 32])(void);
static void (*ram_vectors[16 + 32])(void) __attribute__((aligned(256)));

/* Input edge (EXTI1). CEN starts the run (5 cycles to the CR1 store); while a run is on, CEN is already set and
 * the edge changes nothing (ignore rule). Then the pending flags are cleared. */
__attribute__((naked, section(".data.ramcode"))) void trig_edge_isr(void)
{
  __asm__ volatile(
      "ldr r0, =%c[cr1]\n\t"
      "movs r1, #9\n\t"
      "str r1, [r0]\n\t"
      "ldr r0, =%c[rpr]\n\t"
      "movs r1, #%c[line]\n\t"
      "str r1, [r0]\n\t"
      "str r1, [r0, #4]\n\t"
      "bx lr\n\t"
      ".ltorg\n\t"
      :
      : [egr] "i"(0x40000000u + 0x14u), [cr1] "i"(0x40000000u), [rpr] "i"(EXTI_BASE + 0x0Cu),
        [line] "i"(1u << 1));
}

int main(void)
{
  clock_init();
  RCC_IOPENR |= (1u << 0); /* GPIOAEN */
  RCC_APBENR1 |= (1u << 0); /* TIM2EN */

  /* Vector table in SRAM (VTOR, ARMv6-M Architecture Reference Manual, System Control Block). */
  for (uint32_t i = 0u; i < 16u + 32u; i++) {
    ram_vectors[i] = vector_table[i];
  }
  ram_vectors[16u + 5u] = trig_edge_isr; /* EXTI0_1 */
  TRIG_VTOR = (uint32_t)ram_vectors;

  /* TIM2 stopped at count 0: PSC 0, ARR 65599, CCR1 64000, OC1M = 111 (PWM mode 2),
   * CC1E; UG loads PSC, then UIF is cleared; OPM set, CEN clear. */
  TIM2->CR1 = 0u;
  TIM2->PSC = 0u;
  TIM2->ARR = 65599u;
  TIM2->CCR1 = 64000u;
  TIM2->CCMR1 = (7u << 4);
  TIM2->CCER = 1u;
  TIM2->EGR = 1u;
  TIM2->SR = 0u;
  TIM2->CR1 = (1u << 3); /* OPM */

  /* PA0 as alternate function AF2 (TIM2_CH1) */
  GPIOA->AFR[0] = (GPIOA->AFR[0] & ~(15u << 0)) | (2u << 0);
  GPIOA->MODER = (GPIOA->MODER & ~(3u << 0u * 2u)) | (2u << 0u * 2u);

  /* Input PA1: input mode (MODER 00) with the pull-up (PUPDR 01). */
  GPIOA->MODER &= ~(3u << 1u * 2u);
  GPIOA->PUPDR = (GPIOA->PUPDR & ~(3u << 1u * 2u)) | (1u << 1u * 2u);

  /* EXTI1 from port A (EXTICR1 field = 0); EXTI_RTSR1 and EXTI_FTSR1 bit 1 */
  EXTI_EXTICR1 &= ~(0xFFu << 8);
  EXTI_RTSR1 |= (1u << 1);
  EXTI_FTSR1 |= (1u << 1);
  EXTI_RPR1 = (1u << 1);
  EXTI_FPR1 = (1u << 1);
  EXTI_IMR1 |= (1u << 1);
  NVIC_ISER = (1u << 5);

  /* Busy loop (one branch) rather than wfi, so waking adds nothing to the latency. */
  for (;;) {
  }
}
