/* Timing constants — PIC12F1840 TIMER2 pwm
 * Retrofit: Ostberg pump house lead-lag timer, revision r3, engine 1.0.0
 * Achieved period 1.000000 ms (+0.000 ppm),
 * high time 250.0000 us (+0.000 ppm).
 * period = (PR2+1) * 4 * Tosc * prescale * softwareDivider
 *        = 250 * 64 * 1 / 16000000
 */
#ifndef TIMING_H
#define TIMING_H

#define _XTAL_FREQ 16000000UL
#define TIMING_SOFT_DIVIDER 1UL

#endif
