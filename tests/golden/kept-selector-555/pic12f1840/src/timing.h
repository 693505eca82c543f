/* Timing constants — PIC12F1840 TIMER2 pwm
 * Retrofit: Ostberg pump house lead-lag timer, revision r1, engine 1.0.0
 * Achieved period 1.456000 ms (+274.801 ppm),
 * high time 764.0000 us (+2098.636 ppm).
 * period = (PR2+1) * 4 * Tosc * prescale * softwareDivider
 *        = 91 * 256 * 1 / 16000000
 */
#ifndef TIMING_H
#define TIMING_H

#define _XTAL_FREQ 16000000UL
#define TIMING_SOFT_DIVIDER 1UL

#endif
