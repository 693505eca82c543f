/* Timing constants — MSP430G2553 TIMER0_A3 isr
 * Retrofit: Ostberg pump house lead-lag timer, revision r1, engine 1.0.0
 * Achieved period 10.00000 ms (+0.000 ppm),
 * high time 100.0000 us (+0.000 ppm).
 * period = ID * (TACCR0+1) * modeFactor * softwareDivider / f
 *        = 1 * 4100 * 1 * 1 / 1000000
 */
#ifndef TIMING_H
#define TIMING_H

#define TIMING_CLOCK_HZ 1000000UL
#define TIMING_SOFT_DIVIDER 1UL
#define TIMING_HIGH_TICKS 100UL

#endif
