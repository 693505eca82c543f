/* RP2040 registers used by this firmware. Addresses from the RP2040
 * datasheet (address map; RESETS, CLOCKS, XOSC, PLL, IO_BANK0, PADS_BANK0,
 * SIO and PWM register lists; atomic clear alias at +0x3000). */
#ifndef RP2040_REGS_H
#define RP2040_REGS_H

#include <stdint.h>

#define REG32(addr) (*(volatile uint32_t *)(addr))
#define ALIAS_CLR 0x3000u

#define RESETS_BASE 0x4000C000u
#define RESETS_RESET_CLR REG32(RESETS_BASE + ALIAS_CLR + 0x0u)
#define RESETS_RESET_DONE REG32(RESETS_BASE + 0x8u)
#define RESETS_IO_BANK0 (1u << 5)
#define RESETS_PADS_BANK0 (1u << 8)
#define RESETS_PLL_SYS (1u << 12)
#define RESETS_PWM (1u << 14)

#define CLOCKS_BASE 0x40008000u
#define CLK_REF_CTRL REG32(CLOCKS_BASE + 0x30u)
#define CLK_REF_SELECTED REG32(CLOCKS_BASE + 0x38u)
#define CLK_SYS_CTRL REG32(CLOCKS_BASE + 0x3Cu)
#define CLK_SYS_SELECTED REG32(CLOCKS_BASE + 0x44u)

#define XOSC_BASE 0x40024000u
#define XOSC_CTRL REG32(XOSC_BASE + 0x00u)
#define XOSC_STATUS REG32(XOSC_BASE + 0x04u)
#define XOSC_STARTUP REG32(XOSC_BASE + 0x0Cu)

#define PLL_SYS_BASE 0x40028000u
#define PLL_SYS_CS REG32(PLL_SYS_BASE + 0x0u)
#define PLL_SYS_PWR REG32(PLL_SYS_BASE + 0x4u)
#define PLL_SYS_FBDIV_INT REG32(PLL_SYS_BASE + 0x8u)
#define PLL_SYS_PRIM REG32(PLL_SYS_BASE + 0xCu)

#define IO_BANK0_BASE 0x40014000u
#define IO_BANK0_GPIO_CTRL(n) REG32(IO_BANK0_BASE + 8u * (n) + 4u)
#define PADS_BANK0_BASE 0x4001C000u
#define PADS_BANK0_GPIO(n) REG32(PADS_BANK0_BASE + 4u + 4u * (n))

#define SIO_BASE 0xD0000000u
#define SIO_GPIO_OUT_SET REG32(SIO_BASE + 0x14u)
#define SIO_GPIO_OUT_CLR REG32(SIO_BASE + 0x18u)
#define SIO_GPIO_OE_SET REG32(SIO_BASE + 0x24u)

#define PWM_BASE 0x40050000u
#define PWM_CH_CSR(n) REG32(PWM_BASE + 0x14u * (n) + 0x00u)
#define PWM_CH_DIV(n) REG32(PWM_BASE + 0x14u * (n) + 0x04u)
#define PWM_CH_CTR(n) REG32(PWM_BASE + 0x14u * (n) + 0x08u)
#define PWM_CH_CC(n) REG32(PWM_BASE + 0x14u * (n) + 0x0Cu)
#define PWM_CH_TOP(n) REG32(PWM_BASE + 0x14u * (n) + 0x10u)
#define PWM_EN REG32(PWM_BASE + 0xA0u)
#define PWM_INTR REG32(PWM_BASE + 0xA4u)
#define PWM_INTE REG32(PWM_BASE + 0xA8u)
#define PWM_INTS REG32(PWM_BASE + 0xB0u)
#define PWM_IRQ_WRAP 4u

#define NVIC_ISER REG32(0xE000E100u)

#endif
