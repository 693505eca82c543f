/* Timing constants — ATtiny85 TIMER0 pwm
 * Retrofit: Ostberg pump house lead-lag timer, revision r2, engine 1.0.0
 * Achieved period 1.456000 ms (+274.801 ppm),
 * high time 760.0000 us (-3147.954 ppm).
 * period = divider * periodCounts * modeFactor * softwareDivider / F_CPU
 *        = 64 * 182 * 1 * 1 / 8000000
 */
#ifndef TIMING_H
#define TIMING_H

#ifndef F_CPU
#define F_CPU 8000000UL
#endif

#define TIMING_DIVIDER 64u
#define TIMING_PERIOD_COUNTS 182u
#define TIMING_HIGH_COUNTS 95u
#define TIMING_MODE_FACTOR 1u
/* interrupts per output period (1 = hardware only) */
#define TIMING_SOFT_DIVIDER 1UL

#endif
