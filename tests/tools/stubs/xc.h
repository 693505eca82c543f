/* Test-only stand-in for MPLAB XC8's <xc.h>, PIC12F1840 only. It declares
 * exactly the register and bit names of the PIC12(L)F1840 datasheet
 * (Microchip DS40001441) that generated code may use, with the datasheet's
 * bit layout, so a host `gcc -fsyntax-only` rejects any name the device lacks.
 * Register addresses are irrelevant to a syntax check and are not modelled. */
#ifndef CG_STUB_XC_H
#define CG_STUB_XC_H
#include <stdint.h>

#define __interrupt(...)

/* OSCCON: SPLLEN IRCF<3:0> - SCS<1:0> (Oscillator Module chapter) */
extern volatile uint8_t OSCCON;
/* OSCSTAT: T1OSCR PLLR OSTS HFIOFR HFIOFL MFIOFR LFIOFR HFIOFS (Register 5-2) */
extern volatile uint8_t OSCSTAT;
typedef union {
  struct { unsigned HFIOFS : 1, LFIOFR : 1, MFIOFR : 1, HFIOFL : 1, HFIOFR : 1, OSTS : 1, PLLR : 1, T1OSCR : 1; };
} OSCSTATbits_t;
extern volatile OSCSTATbits_t OSCSTATbits;
/* PORTA / LATA / TRISA / ANSELA (I/O Ports chapter) */
extern volatile uint8_t PORTA, LATA, TRISA, ANSELA;
typedef union {
  struct { unsigned LATA0 : 1, LATA1 : 1, LATA2 : 1, : 1, LATA4 : 1, LATA5 : 1, : 2; };
} LATAbits_t;
extern volatile LATAbits_t LATAbits;
typedef union {
  struct { unsigned TRISA0 : 1, TRISA1 : 1, TRISA2 : 1, TRISA3 : 1, TRISA4 : 1, TRISA5 : 1, : 2; };
} TRISAbits_t;
extern volatile TRISAbits_t TRISAbits;
typedef union {
  struct { unsigned ANSA0 : 1, ANSA1 : 1, ANSA2 : 1, : 1, ANSA4 : 1, : 3; };
} ANSELAbits_t;
extern volatile ANSELAbits_t ANSELAbits;
/* APFCON: RXDTSEL SDOSEL SSSEL - T1GSEL TXCKSEL P1BSEL CCP1SEL */
extern volatile uint8_t APFCON;
/* Timer2 (Timer2 Module chapter): TMR2, PR2, T2CON: - T2OUTPS<3:0> TMR2ON T2CKPS<1:0> */
extern volatile uint8_t TMR2, PR2, T2CON;
typedef union {
  struct { unsigned T2CKPS : 2, TMR2ON : 1, T2OUTPS : 4, : 1; };
} T2CONbits_t;
extern volatile T2CONbits_t T2CONbits;
/* CCP1 (Capture/Compare/PWM chapter): CCPR1L, CCPR1H, CCP1CON: P1M<1:0> DC1B<1:0> CCP1M<3:0> */
extern volatile uint8_t CCPR1L, CCPR1H, CCP1CON;
typedef union {
  struct { unsigned CCP1M : 4, DC1B : 2, P1M : 2; };
} CCP1CONbits_t;
extern volatile CCP1CONbits_t CCP1CONbits;
/* Interrupts chapter: INTCON GIE PEIE TMR0IE INTE IOCIE TMR0IF INTF IOCIF; PIE1 / PIR1 */
extern volatile uint8_t INTCON, PIE1, PIR1;
typedef union {
  struct { unsigned IOCIF : 1, INTF : 1, TMR0IF : 1, IOCIE : 1, INTE : 1, TMR0IE : 1, PEIE : 1, GIE : 1; };
} INTCONbits_t;
extern volatile INTCONbits_t INTCONbits;
typedef union {
  struct { unsigned TMR1IE : 1, TMR2IE : 1, CCP1IE : 1, SSP1IE : 1, TXIE : 1, RCIE : 1, ADIE : 1, TMR1GIE : 1; };
} PIE1bits_t;
extern volatile PIE1bits_t PIE1bits;
typedef union {
  struct { unsigned TMR1IF : 1, TMR2IF : 1, CCP1IF : 1, SSP1IF : 1, TXIF : 1, RCIF : 1, ADIF : 1, TMR1GIF : 1; };
} PIR1bits_t;
extern volatile PIR1bits_t PIR1bits;
/* ADC chapter: ADCON0: - CHS<4:0> GO/nDONE ADON; ADCON1: ADFM ADCS<2:0> - - ADPREF<1:0>; ADRESH, ADRESL */
extern volatile uint8_t ADCON0, ADCON1, ADRESH, ADRESL;
typedef union {
  struct { unsigned ADON : 1, GO_nDONE : 1, CHS : 5, : 1; };
} ADCON0bits_t;
extern volatile ADCON0bits_t ADCON0bits;
typedef union {
  struct { unsigned ADPREF : 2, : 2, ADCS : 3, ADFM : 1; };
} ADCON1bits_t;
extern volatile ADCON1bits_t ADCON1bits;

/* Interrupt-on-change chapter: IOCAP, IOCAN, IOCAF (bits IOCAx5..0) */
extern volatile uint8_t IOCAP, IOCAN, IOCAF;
typedef union {
  struct { unsigned IOCAF0 : 1, IOCAF1 : 1, IOCAF2 : 1, IOCAF3 : 1, IOCAF4 : 1, IOCAF5 : 1, : 2; };
} IOCAFbits_t;
extern volatile IOCAFbits_t IOCAFbits;
/* OPTION_REG: nWPUEN INTEDG TMR0CS TMR0SE PSA PS<2:0>; WPUA (weak pull-ups, I/O Ports chapter) */
extern volatile uint8_t OPTION_REG, WPUA;

#endif
