/* MSP430G2553 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r1, engine 1.0.0; target 5 (msp430g2553)
 * TIMER0_A3, mode pwm, clock 1.000000 MHz (calibrated DCO 1 MHz), output P1.2 (TA0.1, pin 4)
 * Period 1.456000 ms (+274.801 ppm), high 762.0000 us (-524.659 ppm)
 * Register values: MSP430x2xx Family User's Guide (SLAU144: Timer_A, Basic
 * Clock Module+). Builds with clang --target=msp430 against the msp430mcu
 * headers (see Makefile); start-up and vectors are in startup.S and device.ld.
 */
#include <msp430.h>
#include <stdint.h>
#include "timing.h"

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
  P1DIR |= BIT2; /* P1.2 output (TA0.1) */
  P1SEL |= BIT2;
  P1SEL2 &= (uint8_t)~BIT2;

  /* TACCR0 = periodCounts - 1; period = ID*(TACCR0+1)/f (the calibration constant) -> 0x05AF */
  TA0CCR0 = (TRIM_PERIOD_COUNTS - 1u);
  /* high = TACCR1 counts = 762*ID/f (follows the calibration constant) -> 0x02FA */
  TA0CCR1 = TRIM_HIGH_COUNTS;
  /* reset/set: set at TACCR0, reset at TACCR1 -> 0x00E0 */
  TA0CCTL1 = OUTMOD_7;
  /* SMCLK, divide by 1, up mode; starts the timer -> 0x0210 */
  TA0CTL = TASSEL_2 | ID_0 | MC_1;

  /* Sleep in LPM0: CPU off, SMCLK and ACLK keep the timer running. */
  __asm__ volatile("bis.w %0, r2\n\tnop" : : "i"(LPM0_bits));
  for (;;) {
  }
}
