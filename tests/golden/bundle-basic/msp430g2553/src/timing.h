/* Timing constants — MSP430G2553 TIMER0_A3 isr
 * Retrofit: Kiln 3 firing stage, revision r2, engine 1.0.0
 * Achieved period 2.000000 s (+0.000 ppm),
 * high time 500.0000 ms (+0.000 ppm).
 * period = ID * (TACCR0+1) * modeFactor * softwareDivider / f
 *        = 8 * 62500 * 1 * 4 / 1000000
 */
#ifndef TIMING_H
#define TIMING_H

#define TIMING_CLOCK_HZ 1000000UL
#define TIMING_SOFT_DIVIDER 4UL
#define TIMING_HIGH_TICKS 1UL

#endif
