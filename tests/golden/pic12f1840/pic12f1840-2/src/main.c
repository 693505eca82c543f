/* PIC12F1840 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r3, engine 1.0.0; target 2 (pic12f1840-2)
 * TIMER2, mode isr, clock 16.00000 MHz, output RA2 (GPIO, pin 5)
 * Period 1.000000 s (+0.000 ppm), high 250.0000 ms (+0.000 ppm)
 * Register values: PIC12(L)F1840 datasheet, Timer2 and CCP chapters. Compiler: MPLAB XC8.
 */
#include <xc.h>
#include <stdint.h>
#include "timing.h"

#pragma config FOSC = HS, WDTE = OFF, PWRTE = ON, MCLRE = ON, PLLEN = OFF

/* Software divider: each interrupt first writes the level computed for the
 * interval it starts, so both edges see the same entry latency. */
static volatile uint32_t tick;
static volatile uint8_t level_next = (0 < TIMING_HIGH_TICKS);

void __interrupt() timing_isr(void)
{
  if (PIR1bits.TMR2IF) {
    LATAbits.LATA2 = level_next;
    PIR1bits.TMR2IF = 0;
    uint32_t t = tick + 1;
    if (t >= TIMING_SOFT_DIVIDER) {
      t = 0;
    }
    tick = t;
    level_next = (t < TIMING_HIGH_TICKS);
  }
}

int main(void)
{
  ANSELA = 0x00; /* digital I/O */
  LATAbits.LATA2 = 0;
  TRISAbits.TRISA2 = 0; /* RA2 output (GPIO) */

  /* PR2 = periodCounts - 1; period = (PR2+1)*4*Tosc*prescale -> 0x7C */
  PR2 = 124;
  /* TMR2ON = 1, T2CKPS = 3 (prescale 1:64), postscale 1:1 -> 0x07 */
  T2CON = 0x07;
  PIR1bits.TMR2IF = 0;
  PIE1bits.TMR2IE = 1;
  INTCONbits.PEIE = 1;
  INTCONbits.GIE = 1;

  for (;;) {
  }
}
