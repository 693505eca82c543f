/* PIC12F1840 replacement timing stage, for MPLAB XC8 users
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r1, engine 1.0.0; target 2 (pic12f1840-2)
 * TIMER2, mode isr, clock 4.000000 MHz, output RA2 (GPIO, pin 5)
 * Period 20.00000 ms (+0.000 ppm), high 1.024000 ms (+2.400 %)
 * Register values: PIC12(L)F1840 datasheet (DS40001441), Timer2 and CCP chapters.
 * The flashed image is built from src/main.asm, which makes the same steps in
 * the same order; this file is for builds with the vendor's C compiler.
 */
#include <xc.h>
#include <stdint.h>
#include "timing.h"

/* XT: 4 MHz crystal on OSC1/OSC2 (datasheet Register 4-1 CONFIG1, 4-2 CONFIG2) */
#pragma config FOSC = XT, WDTE = OFF, PWRTE = ON, MCLRE = ON, CP = OFF, CPD = OFF, BOREN = ON, CLKOUTEN = OFF, IESO = OFF, FCMEN = OFF
#pragma config WRT = OFF, PLLEN = OFF, STVREN = ON, BORV = HI, LVP = OFF

/* Triggered one-shot: input RA1 (IOC (IOCAP1/IOCAN1), pin 6), falling edge: IOCAN1 = 1
 * Output RA2 (pin 5): on 63 Timer2 counts after the edge (4.032000 ms), off
 * 16 counts later (1.024000 ms). The same steps as src/main.asm; the latency stated
 * there (104 clocks) is counted for the assembler image, a C compiler's handler is longer. */
#define ON_LEVEL 0x04u
#define OFF_LEVEL 0x00u
static volatile uint8_t phase; /* 1 while the pulse is on */

void __interrupt() trigger_isr(void)
{
  if (IOCAFbits.IOCAF1) {
    T2CONbits.TMR2ON = 0; /* restart rule: stop, count from 0 (clears the prescaler), run */
    TMR2 = 0u;
    T2CONbits.TMR2ON = 1;
    PR2 = 62u;
    PIR1bits.TMR2IF = 0;
    LATA = OFF_LEVEL; /* a running pulse is cut short */
    phase = 0u;
    IOCAFbits.IOCAF1 = 0;
  } else if (PIR1bits.TMR2IF) {
    if (!phase) {
      LATA = ON_LEVEL; /* the delay has run: pulse on */
      PR2 = 15u;
      phase = 1u;
    } else {
      LATA = OFF_LEVEL; /* pulse off, stop until the next edge */
      T2CONbits.TMR2ON = 0;
      TMR2 = 0u;
      PR2 = 62u;
      phase = 0u;
    }
    PIR1bits.TMR2IF = 0;
  }
}

int main(void)
{
  /* all of PORTA digital -> 0x00 */
  ANSELA = 0x00;
  /* output latch at the pulse's off level -> 0x00 */
  LATA = 0x00;
  /* RA2 output (GPIO), RA1 and the rest inputs -> 0x3B */
  TRISA = 0x3B;
  /* nWPUEN = 0: weak pull-ups as WPUA selects -> 0x7F */
  OPTION_REG = 0x7F;
  /* weak pull-up on RA1 only -> 0x02 */
  WPUA = 0x02;
  /* TMR2ON = 0 (stopped), T2CKPS = 3 (prescale 1:64) -> 0x03 */
  T2CON = 0x03;
  /* count from 0 at the first edge -> 0x00 */
  TMR2 = 0x00;
  /* PR2 = delayCounts - 1: the first match ends the delay -> 0x3E */
  PR2 = 62;
  /* no stale match */
  PIR1bits.TMR2IF = 0;
  /* TMR2IE = 1 -> 0x02 */
  PIE1 = 0x02;
  /* rising edges on RA1: off -> 0x00 */
  IOCAP = 0x00;
  /* falling edges on RA1: on -> 0x02 */
  IOCAN = 0x02;
  /* no stale edge -> 0x00 */
  IOCAF = 0x00;
  /* GIE = 1, PEIE = 1, IOCIE = 1 -> 0xC8 */
  INTCON = 0xC8;
  for (;;) {
  }
}
