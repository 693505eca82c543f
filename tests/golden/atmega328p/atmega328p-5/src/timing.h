/* Timing constants — ATmega328P TIMER0 toggle
 * Retrofit: Ostberg pump house lead-lag timer, revision r3, engine 1.0.0
 * Achieved period 2.000000 ms (+0.000 ppm),
 * high time 1.000000 ms (+0.000 ppm).
 * period = divider * periodCounts * modeFactor * softwareDivider / F_CPU
 *        = 64 * 250 * 2 * 1 / 16000000
 */
#ifndef TIMING_H
#define TIMING_H

#ifndef F_CPU
#define F_CPU 16000000UL
#endif

#define TIMING_DIVIDER 64u
#define TIMING_PERIOD_COUNTS 250u
#define TIMING_HIGH_COUNTS 250u
#define TIMING_MODE_FACTOR 2u
/* interrupts per output period (1 = hardware only) */
#define TIMING_SOFT_DIVIDER 1UL

#endif
