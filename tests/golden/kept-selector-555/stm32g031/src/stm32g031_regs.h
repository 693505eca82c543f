/* STM32G031 registers used by this firmware. Addresses and offsets from the
 * RM0444 reference manual (memory map; RCC, GPIO, TIM2/TIM3, FLASH register
 * maps) and the Cortex-M0+ NVIC (ARMv6-M Architecture Reference Manual). */
#ifndef STM32G031_REGS_H
#define STM32G031_REGS_H

#include <stdint.h>

#define REG32(addr) (*(volatile uint32_t *)(addr))

#define FLASH_BASE_R 0x40022000u
#define FLASH_ACR REG32(FLASH_BASE_R + 0x00u)

#define RCC_BASE 0x40021000u
#define RCC_CR REG32(RCC_BASE + 0x00u)
#define RCC_CFGR REG32(RCC_BASE + 0x08u)
#define RCC_PLLCFGR REG32(RCC_BASE + 0x0Cu)
#define RCC_IOPENR REG32(RCC_BASE + 0x34u)
#define RCC_APBENR1 REG32(RCC_BASE + 0x3Cu)

typedef struct {
  volatile uint32_t MODER, OTYPER, OSPEEDR, PUPDR, IDR, ODR, BSRR, LCKR, AFR[2], BRR;
} GPIO_TypeDef;
#define GPIOA ((GPIO_TypeDef *)0x50000000u)
#define GPIOB ((GPIO_TypeDef *)0x50000400u)

typedef struct {
  volatile uint32_t CR1, CR2, SMCR, DIER, SR, EGR, CCMR1, CCMR2, CCER, CNT, PSC, ARR, RCR, CCR1, CCR2, CCR3, CCR4;
} TIM_TypeDef;
#define TIM2 ((TIM_TypeDef *)0x40000000u)
#define TIM3 ((TIM_TypeDef *)0x40000400u)

#define NVIC_ISER REG32(0xE000E100u)

#endif
