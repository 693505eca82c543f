/* MSP430G2553 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r1, engine 1.0.0; target 2 (msp430g2553-2)
 * TIMER0_A3, mode isr, clock 8.000000 MHz (calibrated DCO 8 MHz), output P1.2 (GPIO, pin 4)
 * Period 20.00000 ms (+0.000 ppm), high 1.000000 ms (+0.000 ppm)
 * Register values: MSP430x2xx Family User's Guide (SLAU144: Timer_A, Basic
 * Clock Module+). Builds with clang --target=msp430 against the msp430mcu
 * headers (see Makefile); start-up and vectors are in startup.S and device.ld.
 */
#include <msp430.h>
#include <stdint.h>
#include "timing.h"

/* Triggered one-shot: input P1.3 (P1.3 port interrupt (P1IE/P1IES), pin 5), rising edge: P1IES bit 3 = 0
 * Output P1.2 (pin 4), switched by the Timer0_A3 handlers: on at TAR = TACCR1 = 32000
 * (4.000000 ms after the start), off at TAR = TACCR0 = 40000 (pulse 1.000000 ms), then the
 * timer stops at 0 until the next edge. Counter clock SMCLK/1.
 * Worst-case edge-to-count latency 33 cycles (4.125000 us): MSP430x2xx family user's guide, interrupt acceptance 6 cycles + up to 6 to finish the current instruction; port 1 handler (templates/msp430g2553/trigger.c.hbs, assembler) 5 cycles to the TA0CTL store that starts the count (ignore rule bis.w #MC_1,&TA0CTL; restart rule mov.w #...|MC_1|TACLR,&TA0CTL; family guide instruction cycle table: #N to &EDE 5 cycles); the TACCR1 handler's entry to the P1OUT write adds up to 6 + 6 + 4 (bis.b with a constant-generator mask), the same for the TACCR0 handler's off edge, so it shifts the delay, not the pulse; CPU kept awake (no low-power mode) so no wake-up time adds
 * The handlers are assembler so their cycle counts are fixed (family guide
 * instruction cycle table; numbers after ';'). Addresses: SLAS735 peripheral
 * file map (P1OUT 0x21, P1IFG 0x23, P1IES 0x24, TA0CTL 0x160, TA0CCTL0 0x162,
 * TA0CCTL1 0x164); vectors: clang's section __interrupt_vector_N is slot N at
 * 0xFFE0 + 2*N (PORT1 = 2, TIMER0_A1 = 8, TIMER0_A0 = 9). */
__asm__(
    "  .section .text.trig_edge_isr,\"ax\",@progbits\n"
    "  .global trig_edge_isr\n"
    "trig_edge_isr:\n"
    /* ignore rule: MC_1 starts a stopped timer; a running one is left alone (5: bis #N to &abs) */
    "  bis.w #0x0010, &0x0160\n"
    "  bic.b #0x08, &0x0023\n" /* P1IFG cleared (after any P1IES write) */
    "  reti\n"
    "  .section .text.trig_on_isr,\"ax\",@progbits\n"
    "  .global trig_on_isr\n"
    "trig_on_isr:\n"
    "  bis.b #0x04, &0x0021\n" /* 4: pulse on at TACCR1 */
    "  bic.w #1, &0x0164\n" /* TACCR1 CCIFG */
    "  reti\n"
    "  .section .text.trig_off_isr,\"ax\",@progbits\n"
    "  .global trig_off_isr\n"
    "trig_off_isr:\n"
    "  bic.b #0x04, &0x0021\n" /* 4: pulse off at TACCR0, same path length */
    "  mov.w #0x0204, &0x0160\n" /* MC_0 and TACLR: stopped at 0 (its CCIFG clears on service) */
    "  reti\n"
    "  .section __interrupt_vector_2,\"a\",@progbits\n"
    "  .word trig_edge_isr\n"
    "  .section __interrupt_vector_8,\"a\",@progbits\n"
    "  .word trig_on_isr\n"
    "  .section __interrupt_vector_9,\"a\",@progbits\n"
    "  .word trig_off_isr\n");

int main(void)
{
  /* startup.S already stopped the watchdog before copying .data and .bss. */
  if (CALBC1_8MHZ == 0xFF || CALDCO_8MHZ == 0xFF) {
    for (;;) {
    } /* calibration data erased: never run the output on a wrong clock */
  }
  DCOCTL = 0; /* lowest DCO step first, so the range change cannot overshoot 16 MHz */
  BCSCTL1 = CALBC1_8MHZ; /* DCO range for 8 MHz, factory calibration */
  DCOCTL = CALDCO_8MHZ; /* DCO step and modulation for 8 MHz */
  BCSCTL2 = SELM_0 | DIVS_0; /* MCLK and SMCLK = DCO, undivided */

  P1OUT &= (uint8_t)~BIT2;
  P1DIR |= BIT2; /* P1.2 output (GPIO) */

  /* P1.3 input with pull-up (P1REN, P1OUT = 1) */
  P1DIR &= (uint8_t)~BIT3;
  P1OUT |= BIT3;
  P1REN |= BIT3;

  /* Timer0_A3 stopped at 0: SMCLK/1, TACCR1 = delayCounts, TACCR0 = delayCounts + highCounts */
  /* SMCLK/1, stopped at TAR = 0 until the input edge (the port 1 handler sets MC_1) -> 0x0204 */
  TA0CTL = TASSEL_2 | ID_0 | MC_0 | TACLR;
  /* pulse on at TAR = delayCounts = 32000 -> 0x7D00 */
  TA0CCR1 = 32000u;
  /* pulse off and stop at TAR = delayCounts + highCounts = 40000 -> 0x9C40 */
  TA0CCR0 = 40000u;
  /* TACCR1 interrupt: pulse on -> 0x0010 */
  TA0CCTL1 = CCIE;
  /* TACCR0 interrupt: pulse off, timer stopped -> 0x0010 */
  TA0CCTL0 = CCIE;

  /* P1IES bit 3 = 0 */
  P1IES &= (uint8_t)~BIT3;
  P1IFG &= (uint8_t)~BIT3;
  P1IE |= BIT3;

  /* CPU stays awake (no low-power mode), so no wake-up time adds to the latency. */
  __asm__ volatile("bis.w #8, r2\n\tnop"); /* GIE */
  for (;;) {
  }
}
