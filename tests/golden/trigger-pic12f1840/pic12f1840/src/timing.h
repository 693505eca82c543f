/* Timing constants — PIC12F1840 TIMER2 isr
 * Retrofit: Ostberg pump house lead-lag timer, revision r1, engine 1.0.0
 * Achieved period 10.00000 ms (+0.000 ppm),
 * high time 192.0000 us (-4.000 %).
 * period = (PR2+1) * 4 * Tosc * prescale * softwareDivider
 *        = 66 * 256 * 1 / 4000000
 */
#ifndef TIMING_H
#define TIMING_H

#define _XTAL_FREQ 4000000UL
#define TIMING_SOFT_DIVIDER 1UL
#define TIMING_HIGH_TICKS 3UL

#endif
