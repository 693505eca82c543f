/* Timing constants — MSP430G2553 TIMER0_A3 pwm
 * Retrofit: Ostberg pump house lead-lag timer, revision r3, engine 1.0.0
 * Achieved period 1.000000 ms (+0.000 ppm),
 * high time 250.0000 us (+0.000 ppm).
 * period = ID * (TACCR0+1) * modeFactor * softwareDivider / f
 *        = 1 * 1000 * 1 * 1 / 1000000
 */
#ifndef TIMING_H
#define TIMING_H

#define TIMING_CLOCK_HZ 1000000UL
#define TIMING_SOFT_DIVIDER 1UL

#endif
