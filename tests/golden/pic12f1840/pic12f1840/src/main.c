/* PIC12F1840 replacement timing stage
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r3, engine 1.0.0; target 1 (pic12f1840)
 * TIMER2, mode pwm, clock 16.00000 MHz, output RA2 (CCP1, pin 5)
 * Period 1.000000 ms (+0.000 ppm), high 250.0000 us (+0.000 ppm)
 * Register values: PIC12(L)F1840 datasheet, Timer2 and CCP chapters. Compiler: MPLAB XC8.
 */
#include <xc.h>
#include <stdint.h>
#include "timing.h"

#pragma config FOSC = HS, WDTE = OFF, PWRTE = ON, MCLRE = ON, PLLEN = OFF

int main(void)
{
  ANSELA = 0x00; /* digital I/O */
  LATAbits.LATA2 = 0;
  TRISAbits.TRISA2 = 0; /* RA2 output (CCP1) */

  /* PR2 = periodCounts - 1; period = (PR2+1)*4*Tosc*prescale -> 0xF9 */
  PR2 = 249;
  /* CCP1SEL = 0: CCP1 on RA2 -> 0x00 */
  APFCON = 0x00;
  /* CCPR1L:DC1B = 250 (highCounts*4); pulse = 250*Tosc*prescale -> 0x3E */
  CCPR1L = 62;
  /* DC1B = 2, CCP1M = 1100 (PWM, active high) -> 0x2C */
  CCP1CON = 0x2C;
  /* TMR2ON = 1, T2CKPS = 2 (prescale 1:16), postscale 1:1 -> 0x06 */
  T2CON = 0x06;

  for (;;) {
  }
}
