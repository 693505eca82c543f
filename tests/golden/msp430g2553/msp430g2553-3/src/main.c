/* MSP430G2553 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r3, engine 1.0.0; target 3 (msp430g2553-3)
 * TIMER0_A3, mode isr, clock 1.000000 MHz (calibrated DCO 1 MHz), output P1.2 (GPIO, pin 4)
 * Period 1.000000 s (+0.000 ppm), high 250.0000 ms (+0.000 ppm)
 * Register values: MSP430x2xx Family User's Guide (SLAU144: Timer_A, Basic
 * Clock Module+). Builds with clang --target=msp430 against the msp430mcu
 * headers (see Makefile); start-up and vectors are in startup.S and device.ld.
 */
#include <msp430.h>
#include <stdint.h>
#include "timing.h"

/* Software divider: each interrupt first writes the level computed for the
 * interval it starts, so both edges see the same entry latency. */
static volatile uint32_t tick;
static volatile uint8_t level_next = (0 < TIMING_HIGH_TICKS);

/* clang's MSP430 interrupt(N) puts the handler address in section
 * __interrupt_vector_N; device.ld places slot N at 0xFFE0 + 2*N. The
 * msp430mcu header gives vectors as byte offsets from 0xFFE0, hence / 2. */
__attribute__((interrupt(TIMER0_A0_VECTOR / 2))) void timing_isr(void)
{
  if (level_next) {
    P1OUT |= BIT2;
  } else {
    P1OUT &= (uint8_t)~BIT2;
  }
  uint32_t t = tick + 1;
  if (t >= TIMING_SOFT_DIVIDER) {
    t = 0;
  }
  tick = t;
  level_next = (t < TIMING_HIGH_TICKS);
}

int main(void)
{
  /* startup.S already stopped the watchdog before copying .data and .bss. */
  if (CALBC1_1MHZ == 0xFF || CALDCO_1MHZ == 0xFF) {
    for (;;) {
    } /* calibration data erased: never run the output on a wrong clock */
  }
  DCOCTL = 0; /* lowest DCO step first, so the range change cannot overshoot 16 MHz */
  BCSCTL1 = CALBC1_1MHZ; /* DCO range for 1 MHz, factory calibration */
  DCOCTL = CALDCO_1MHZ; /* DCO step and modulation for 1 MHz */
  BCSCTL2 = SELM_0 | DIVS_0; /* MCLK and SMCLK = DCO, undivided */

  P1OUT &= (uint8_t)~BIT2;
  P1DIR |= BIT2; /* P1.2 output (GPIO) */

  /* TACCR0 = periodCounts - 1; period = ID*(TACCR0+1)/f -> 0xF423 */
  TA0CCR0 = 62499;
  /* TACCR0 interrupt on -> 0x0010 */
  TA0CCTL0 = CCIE;
  /* SMCLK, divide by 4, up mode; starts the timer -> 0x0290 */
  TA0CTL = TASSEL_2 | ID_2 | MC_1;

  /* Sleep in LPM0: CPU off, SMCLK and ACLK keep the timer running. */
  __asm__ volatile("bis.w %0, r2\n\tnop" : : "i"(LPM0_bits | GIE));
  for (;;) {
  }
}
