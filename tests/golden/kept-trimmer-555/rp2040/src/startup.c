/* Minimal Cortex-M0+ start-up for the RP2040: vector table at 0x10000100
 * (RP2040 datasheet, interrupt list: PWM_IRQ_WRAP = IRQ 4), .data copy,
 * .bss clear. Boot stage 2 (src/boot2.S, first 256 bytes of flash) sets
 * VTOR to this table, loads SP from its first word and jumps to
 * Reset_Handler; the code runs in place from flash at 0x10000000. */
#include <stdint.h>

extern uint32_t _sidata, _sdata, _edata, _sbss, _ebss, _estack;
int main(void);

void Reset_Handler(void)
{
  uint32_t *src = &_sidata;
  for (uint32_t *dst = &_sdata; dst < &_edata;) {
    *dst++ = *src++;
  }
  for (uint32_t *dst = &_sbss; dst < &_ebss;) {
    *dst++ = 0;
  }
  main();
  for (;;) {
  }
}

void Default_Handler(void)
{
  for (;;) {
  }
}

void PWM_IRQ_WRAP_Handler(void) __attribute__((weak, alias("Default_Handler")));

__attribute__((section(".vectors"), used)) void (*const vector_table[16 + 32])(void) = {
  (void (*)(void))(&_estack),
  Reset_Handler,
  [2 ... 19] = Default_Handler,
  [16 + 4] = PWM_IRQ_WRAP_Handler,
  [21 ... 47] = Default_Handler,
};
