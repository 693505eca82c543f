/* Timing constants — ATmega328P TIMER1 isr
 * Retrofit: Ostberg pump house lead-lag timer, revision r1, engine 1.0.0
 * Achieved period 500.0000 ms (+0.000 ppm),
 * high time 110.0000 ms (+0.000 ppm).
 * period = divider * periodCounts * modeFactor * softwareDivider / F_CPU
 *        = 64 * 27501 * 1 * 1 / 16000000
 */
#ifndef TIMING_H
#define TIMING_H

#ifndef F_CPU
#define F_CPU 16000000UL
#endif

#define TIMING_DIVIDER 64u
#define TIMING_PERIOD_COUNTS 27501u
#define TIMING_HIGH_COUNTS 27500u
#define TIMING_MODE_FACTOR 1u
/* interrupts per output period (1 = hardware only) */
#define TIMING_SOFT_DIVIDER 1UL
/* interrupts the output stays high */
#define TIMING_HIGH_TICKS 27500UL

#endif
