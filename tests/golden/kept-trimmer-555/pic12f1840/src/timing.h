/* Timing constants — PIC12F1840 TIMER2 pwm
 * Retrofit: Ostberg pump house lead-lag timer, revision r1, engine 1.0.0
 * Achieved period 1.456000 ms (+274.801 ppm),
 * high time 762.0000 us (-524.659 ppm).
 * period = (PR2+1) * 4 * Tosc * prescale * softwareDivider
 *        = 182 * 64 * 1 / 8000000
 */
#ifndef TIMING_H
#define TIMING_H

#define _XTAL_FREQ 8000000UL
#define TIMING_SOFT_DIVIDER 1UL

#endif
