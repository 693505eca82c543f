/* Timing constants — ATmega328P TIMER1 pwm
 * Retrofit: Ostberg pump house lead-lag timer, revision r2, engine 1.0.0
 * Achieved period 1.455625 ms (+17.175 ppm),
 * high time 762.3750 us (-32.791 ppm).
 * period = divider * periodCounts * modeFactor * softwareDivider / F_CPU
 *        = 1 * 23290 * 1 * 1 / 16000000
 */
#ifndef TIMING_H
#define TIMING_H

#ifndef F_CPU
#define F_CPU 16000000UL
#endif

#define TIMING_DIVIDER 1u
#define TIMING_PERIOD_COUNTS 23290u
#define TIMING_HIGH_COUNTS 12198u
#define TIMING_MODE_FACTOR 1u
/* interrupts per output period (1 = hardware only) */
#define TIMING_SOFT_DIVIDER 1UL

#endif
