/* Timing constants — ATmega328P TIMER1 isr
 * Retrofit: Ostberg pump house lead-lag timer, revision r1, engine 1.0.0
 * Achieved period 10.00000 ms (+0.000 ppm),
 * high time 100.0000 us (+0.000 ppm).
 * period = divider * periodCounts * modeFactor * softwareDivider / F_CPU
 *        = 8 * 8200 * 1 * 1 / 16000000
 */
#ifndef TIMING_H
#define TIMING_H

#ifndef F_CPU
#define F_CPU 16000000UL
#endif

#define TIMING_DIVIDER 8u
#define TIMING_PERIOD_COUNTS 8200u
#define TIMING_HIGH_COUNTS 200u
#define TIMING_MODE_FACTOR 1u
/* interrupts per output period (1 = hardware only) */
#define TIMING_SOFT_DIVIDER 1UL
/* interrupts the output stays high */
#define TIMING_HIGH_TICKS 200UL

#endif
