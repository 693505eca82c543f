/* MSP430G2553 start-up, revision r1 (msp430g2553).
 * Reset: stop the watchdog first (it runs from reset with a 32768-cycle
 * timeout, SLAU144 watchdog chapter), set the stack, copy .data, clear .bss,
 * call main. Every vector slot this image does not use points at
 * unexpected_irq, which forces a clean restart (a WDTCTL write without the
 * password causes a PUC, SLAU144). No C runtime library is linked. */
#include <msp430.h>

  .section .text.reset,"ax",@progbits
  .global reset_entry
  .type reset_entry,@function
reset_entry:
  mov.w #(WDTPW | WDTHOLD), &WDTCTL
  mov.w #__stack_top, r1
  mov.w #__data_load, r12
  mov.w #__data_start, r13
copy_data:
  cmp.w #__data_end, r13
  jhs copy_done
  /* word copy split in two steps: LLVM's MSP430 assembler rejects @rN+ to an indexed destination */
  mov.w @r12, 0(r13)
  incd.w r12
  incd.w r13
  jmp copy_data
copy_done:
  mov.w #__bss_start, r13
clear_bss:
  cmp.w #__bss_end, r13
  jhs clear_done
  mov.w #0, 0(r13)
  incd.w r13
  jmp clear_bss
clear_done:
  call #main
park:
  jmp park

  .section .text.unexpected_irq,"ax",@progbits
  .global unexpected_irq
  .type unexpected_irq,@function
unexpected_irq:
  mov.w #0, &WDTCTL
  jmp unexpected_irq

  .section __interrupt_vector_15,"a",@progbits
  .word reset_entry
  .section __interrupt_vector_0,"a",@progbits
  .word unexpected_irq
  .section __interrupt_vector_1,"a",@progbits
  .word unexpected_irq
  .section __interrupt_vector_2,"a",@progbits
  .word unexpected_irq
  .section __interrupt_vector_3,"a",@progbits
  .word unexpected_irq
  .section __interrupt_vector_4,"a",@progbits
  .word unexpected_irq
  .section __interrupt_vector_5,"a",@progbits
  .word unexpected_irq
  .section __interrupt_vector_6,"a",@progbits
  .word unexpected_irq
  .section __interrupt_vector_7,"a",@progbits
  .word unexpected_irq
  .section __interrupt_vector_8,"a",@progbits
  .word unexpected_irq
  .section __interrupt_vector_9,"a",@progbits
  .word unexpected_irq
  .section __interrupt_vector_10,"a",@progbits
  .word unexpected_irq
  .section __interrupt_vector_11,"a",@progbits
  .word unexpected_irq
  .section __interrupt_vector_12,"a",@progbits
  .word unexpected_irq
  .section __interrupt_vector_13,"a",@progbits
  .word unexpected_irq
  .section __interrupt_vector_14,"a",@progbits
  .word unexpected_irq
