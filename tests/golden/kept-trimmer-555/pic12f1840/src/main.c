/* PIC12F1840 replacement timing stage, for MPLAB XC8 users
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r1, engine 1.0.0; target 6 (pic12f1840)
 * TIMER2, mode pwm, clock 8.000000 MHz, output RA2 (CCP1, pin 5)
 * Period 1.456000 ms (+274.801 ppm), high 762.0000 us (-524.659 ppm)
 * Register values: PIC12(L)F1840 datasheet (DS40001441), Timer2 and CCP chapters.
 * The flashed image is built from src/main.asm, which makes the same steps in
 * the same order; this file is for builds with the vendor's C compiler.
 */
#include <xc.h>
#include <stdint.h>
#include "timing.h"

/* INTOSC: internal oscillator, RA4 and RA5 free (datasheet Register 4-1 CONFIG1, 4-2 CONFIG2) */
#pragma config FOSC = INTOSC, WDTE = OFF, PWRTE = ON, MCLRE = ON, CP = OFF, CPD = OFF, BOREN = ON, CLKOUTEN = OFF, IESO = OFF, FCMEN = OFF
#pragma config WRT = OFF, PLLEN = OFF, STVREN = ON, BORV = HI, LVP = OFF

int main(void)
{
  /* IRCF = 1110: 8 MHz HFINTOSC, SCS = 00 (clock from FOSC = INTOSC) -> 0x70 */
  OSCCON = 0x70;
  /* HFIOFR: oscillator ready */
  while (!OSCSTATbits.HFIOFR) {
  }
  /* all of PORTA digital -> 0x00 */
  ANSELA = 0x00;
  /* output latch low before the driver is on -> 0x00 */
  LATA = 0x00;
  /* PWM setup 1: RA2 driver off (TRISA2 = 1) -> 0x3F */
  TRISA = 0x3F;
  /* CCP1SEL = 0: CCP1 on RA2 -> 0x00 */
  APFCON = 0x00;
  /* PR2 = periodCounts - 1; period = (PR2+1)*4*Tosc*prescale (the calibration constant) -> 0xB5 */
  PR2 = (TRIM_PERIOD_COUNTS - 1);
  /* PWM setup 3: DC1B = 1, CCP1M = 1100 (PWM, active high) (DC1B follows the constant) -> 0x1C */
  CCP1CON = (((TRIM_HIGH_COUNTS & 3) << 4) | 0x0C);
  /* PWM setup 4: CCPR1L:DC1B = 381 (highCounts*4); pulse = 381*Tosc*prescale (follows the calibration constant) -> 0x5F */
  CCPR1L = (TRIM_HIGH_COUNTS >> 2);
  /* PWM setup 5: clear TMR2IF before Timer2 starts */
  PIR1bits.TMR2IF = 0;
  /* TMR2ON = 1, T2CKPS = 2 (prescale 1:16), postscale 1:1 -> 0x06 */
  T2CON = 0x06;
  /* PWM setup 6: Timer2 has overflowed once */
  while (!PIR1bits.TMR2IF) {
  }
  /* PWM setup 6: RA2 driver on (TRISA2 = 0) -> 0x3B */
  TRISA = 0x3B;

  for (;;) {
  }
}
