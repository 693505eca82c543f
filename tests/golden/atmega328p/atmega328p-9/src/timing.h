/* Timing constants — ATmega328P TIMER2 isr
 * Retrofit: Ostberg pump house lead-lag timer, revision r3, engine 1.0.0
 * Achieved period 1.000000 s (+0.000 ppm),
 * high time 250.0000 ms (+0.000 ppm).
 * period = divider * periodCounts * modeFactor * softwareDivider / F_CPU
 *        = 128 * 250 * 1 * 500 / 16000000
 */
#ifndef TIMING_H
#define TIMING_H

#ifndef F_CPU
#define F_CPU 16000000UL
#endif

#define TIMING_DIVIDER 128u
#define TIMING_PERIOD_COUNTS 250u
#define TIMING_HIGH_COUNTS 125u
#define TIMING_MODE_FACTOR 1u
/* interrupts per output period (1 = hardware only) */
#define TIMING_SOFT_DIVIDER 500UL
/* interrupts the output stays high */
#define TIMING_HIGH_TICKS 125UL

#endif
