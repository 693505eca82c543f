/* Minimal Cortex-M0+ start-up for the STM32G031: vector table (RM0444,
 * interrupt and exception vectors; TIM2 = IRQ 15, TIM3 = IRQ 16, from
 * memory), .data copy and .bss clear, then main. */
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

void TIM2_IRQHandler(void) __attribute__((weak, alias("Default_Handler")));
void TIM3_IRQHandler(void) __attribute__((weak, alias("Default_Handler")));

__attribute__((section(".isr_vector"), used)) void (*const vector_table[16 + 32])(void) = {
  (void (*)(void))(&_estack),
  Reset_Handler,
  [2 ... 30] = Default_Handler,
  [16 + 15] = TIM2_IRQHandler,
  [16 + 16] = TIM3_IRQHandler,
  [33 ... 47] = Default_Handler,
};
