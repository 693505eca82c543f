/* Timing constants — MSP430G2553 TIMER0_A3 pwm
 * Retrofit: Ostberg pump house lead-lag timer, revision r1, engine 1.0.0
 * Achieved period 1.456000 ms (+274.801 ppm),
 * high time 762.0000 us (-524.659 ppm).
 * period = ID * (TACCR0+1) * modeFactor * softwareDivider / f
 *        = 1 * 1456 * 1 * 1 / 1000000
 */
#ifndef TIMING_H
#define TIMING_H

#define TIMING_CLOCK_HZ 1000000UL
#define TIMING_SOFT_DIVIDER 1UL

#endif
