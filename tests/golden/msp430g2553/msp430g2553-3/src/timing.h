/* Timing constants — MSP430G2553 TIMER0_A3 isr
 * Retrofit: Ostberg pump house lead-lag timer, revision r3, engine 1.0.0
 * Achieved period 1.000000 s (+0.000 ppm),
 * high time 250.0000 ms (+0.000 ppm).
 * period = ID * (TACCR0+1) * modeFactor * softwareDivider / f
 *        = 4 * 62500 * 1 * 4 / 1000000
 */
#ifndef TIMING_H
#define TIMING_H

#define TIMING_CLOCK_HZ 1000000UL
#define TIMING_SOFT_DIVIDER 4UL
#define TIMING_HIGH_TICKS 1UL

#endif
