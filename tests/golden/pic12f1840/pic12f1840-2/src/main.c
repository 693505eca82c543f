/* PIC12F1840 replacement timing stage, for MPLAB XC8 users
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r3, engine 1.0.0; target 2 (pic12f1840-2)
 * TIMER2, mode isr, clock 16.00000 MHz, output RA2 (GPIO, pin 5)
 * Period 1.000000 s (+0.000 ppm), high 250.0000 ms (+0.000 ppm)
 * Register values: PIC12(L)F1840 datasheet (DS40001441), Timer2 and CCP chapters.
 * The flashed image is built from src/main.asm, which makes the same steps in
 * the same order; this file is for builds with the vendor's C compiler.
 */
#include <xc.h>
#include <stdint.h>
#include "timing.h"

/* HS: 16 MHz crystal on OSC1/OSC2 (datasheet Register 4-1 CONFIG1, 4-2 CONFIG2) */
#pragma config FOSC = HS, WDTE = OFF, PWRTE = ON, MCLRE = ON, CP = OFF, CPD = OFF, BOREN = ON, CLKOUTEN = OFF, IESO = OFF, FCMEN = OFF
#pragma config WRT = OFF, PLLEN = OFF, STVREN = ON, BORV = HI, LVP = OFF

/* Software divider: each interrupt first writes the level computed for the
 * interval it starts, in the same time whatever it is, so both edges see the
 * same entry latency. */
#define PIN_MASK 0x04u
static volatile uint32_t tick;
static volatile uint8_t level_next = 0x04;

void __interrupt() timing_isr(void)
{
  if (PIR1bits.TMR2IF) {
    LATA = (uint8_t)((LATA & (uint8_t)~PIN_MASK) | level_next);
    PIR1bits.TMR2IF = 0;
    uint32_t t = tick + 1;
    if (t >= TIMING_SOFT_DIVIDER) {
      t = 0;
    }
    tick = t;
    level_next = (t < TIMING_HIGH_TICKS) ? PIN_MASK : 0;
  }
}

int main(void)
{
  /* all of PORTA digital -> 0x00 */
  ANSELA = 0x00;
  /* output latch low before the driver is on -> 0x00 */
  LATA = 0x00;
  /* RA2 output (GPIO), the rest inputs -> 0x3B */
  TRISA = 0x3B;
  /* PR2 = periodCounts - 1; period = (PR2+1)*4*Tosc*prescale -> 0x7C */
  PR2 = 124;
  /* PWM setup 5: clear TMR2IF before Timer2 starts */
  PIR1bits.TMR2IF = 0;
  /* TMR2ON = 1, T2CKPS = 3 (prescale 1:64), postscale 1:1 -> 0x07 */
  T2CON = 0x07;
  /* TMR2IE = 1 -> 0x02 */
  PIE1 = 0x02;
  /* GIE = 1, PEIE = 1 -> 0xC0 */
  INTCON = 0xC0;

  for (;;) {
  }
}
