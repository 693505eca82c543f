/* PIC12F1840 replacement timing stage, for MPLAB XC8 users
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r1, engine 1.0.0; target 6 (pic12f1840)
 * TIMER2, mode pwm, clock 16.00000 MHz, output RA2 (CCP1, pin 5)
 * Period 1.456000 ms (+274.801 ppm), high 764.0000 us (+2098.636 ppm)
 * Register values: PIC12(L)F1840 datasheet (DS40001441), Timer2 and CCP chapters.
 * The flashed image is built from src/main.asm, which makes the same steps in
 * the same order; this file is for builds with the vendor's C compiler.
 */
#include <xc.h>
#include <stdint.h>
#include "timing.h"
#include "selector_control.h"

/* INTOSC: internal oscillator, RA4 and RA5 free (datasheet Register 4-1 CONFIG1, 4-2 CONFIG2) */
#pragma config FOSC = INTOSC, WDTE = OFF, PWRTE = ON, MCLRE = ON, CP = OFF, CPD = OFF, BOREN = ON, CLKOUTEN = OFF, IESO = OFF, FCMEN = OFF
#pragma config WRT = OFF, PLLEN = OFF, STVREN = ON, BORV = HI, LVP = OFF

int main(void)
{
  /* IRCF = 1111: 16 MHz HFINTOSC, SCS = 00 (clock from FOSC = INTOSC) -> 0x78 */
  OSCCON = 0x78;
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
  /* PR2 = periodCounts - 1; period = (PR2+1)*4*Tosc*prescale -> 0x5A */
  PR2 = 90;
  /* PWM setup 3: DC1B = 3, CCP1M = 1100 (PWM, active high) -> 0x3C */
  CCP1CON = 0x3C;
  /* PWM setup 4: CCPR1L:DC1B = 191 (highCounts*4); pulse = 191*Tosc*prescale -> 0x2F */
  CCPR1L = 47;
  /* PWM setup 5: clear TMR2IF before Timer2 starts */
  PIR1bits.TMR2IF = 0;
  /* TMR2ON = 1, T2CKPS = 3 (prescale 1:64), postscale 1:1 -> 0x07 */
  T2CON = 0x07;
  /* PWM setup 6: Timer2 has overflowed once */
  while (!PIR1bits.TMR2IF) {
  }
  /* PWM setup 6: RA2 driver on (TRISA2 = 0) -> 0x3B */
  TRISA = 0x3B;

  selector_control_init();
  for (;;) {
    selector_control_poll();
  }
}
