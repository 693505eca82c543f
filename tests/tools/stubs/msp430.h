/* Test-only stand-in for TI's <msp430.h>, MSP430G2553 only. It declares
 * exactly the register and bit names of the MSP430x2xx Family User's Guide
 * (SLAU144: Timer_A, Basic Clock Module+, Watchdog, Digital I/O) and the
 * MSP430G2553 datasheet (SLAS735: calibration data, interrupt vectors) that
 * generated code may use, so a host `gcc -fsyntax-only` rejects any other.
 * Bit values as in those documents; addresses are not modelled. */
#ifndef CG_STUB_MSP430_H
#define CG_STUB_MSP430_H
#include <stdint.h>

/* TI msp430-gcc's in430.h spells the ISR attribute this way (from memory). */
#define __interrupt_vec(vec)
void __bis_SR_register(unsigned int bits);

/* status register bits */
#define GIE 0x0008u
#define CPUOFF 0x0010u
#define LPM0_bits CPUOFF

/* Watchdog */
extern volatile uint16_t WDTCTL;
#define WDTPW 0x5A00u
#define WDTHOLD 0x0080u

/* Basic Clock Module+ */
extern volatile uint8_t DCOCTL, BCSCTL1, BCSCTL2, BCSCTL3;
extern const volatile uint8_t CALDCO_1MHZ, CALBC1_1MHZ, CALDCO_8MHZ, CALBC1_8MHZ;
extern const volatile uint8_t CALDCO_12MHZ, CALBC1_12MHZ, CALDCO_16MHZ, CALBC1_16MHZ;
#define XCAP_0 0x00u
#define XCAP_1 0x04u
#define XCAP_2 0x08u
#define XCAP_3 0x0Cu

/* Digital I/O, ports 1 and 2 */
extern volatile uint8_t P1IN, P1OUT, P1DIR, P1SEL, P1SEL2, P1REN;
extern volatile uint8_t P2IN, P2OUT, P2DIR, P2SEL, P2SEL2, P2REN;
#define BIT0 0x01u
#define BIT1 0x02u
#define BIT2 0x04u
#define BIT3 0x08u
#define BIT4 0x10u
#define BIT5 0x20u
#define BIT6 0x40u
#define BIT7 0x80u

/* Timer0_A3 */
extern volatile uint16_t TA0CTL, TA0R, TA0CCTL0, TA0CCTL1, TA0CCTL2, TA0CCR0, TA0CCR1, TA0CCR2, TA0IV;
#define TASSEL_0 0x0000u
#define TASSEL_1 0x0100u
#define TASSEL_2 0x0200u
#define TASSEL_3 0x0300u
#define ID_0 0x0000u
#define ID_1 0x0040u
#define ID_2 0x0080u
#define ID_3 0x00C0u
#define MC_0 0x0000u
#define MC_1 0x0010u
#define MC_2 0x0020u
#define MC_3 0x0030u
#define TACLR 0x0004u
#define TAIE 0x0002u
#define TAIFG 0x0001u
#define OUTMOD_0 0x0000u
#define OUTMOD_1 0x0020u
#define OUTMOD_2 0x0040u
#define OUTMOD_3 0x0060u
#define OUTMOD_4 0x0080u
#define OUTMOD_5 0x00A0u
#define OUTMOD_6 0x00C0u
#define OUTMOD_7 0x00E0u
#define CCIE 0x0010u
#define CCIFG 0x0001u

/* interrupt vector: Timer0_A3 TACCR0 at 0xFFF2 (datasheet interrupt vector table) */
#define TIMER0_A0_VECTOR (9 * 1u)

#endif
