/* Timing constants — ATtiny85 TIMER0 isr
 * Retrofit: Ostberg pump house lead-lag timer, revision r1, engine 1.0.0
 * Achieved period 10.00000 ms (+0.000 ppm),
 * high time 96.00000 us (-4.000 %).
 * period = divider * periodCounts * modeFactor * softwareDivider / F_CPU
 *        = 256 * 128 * 1 * 1 / 8000000
 */
#ifndef TIMING_H
#define TIMING_H

#ifndef F_CPU
#define F_CPU 8000000UL
#endif

#define TIMING_DIVIDER 256u
#define TIMING_PERIOD_COUNTS 128u
#define TIMING_HIGH_COUNTS 3u
#define TIMING_MODE_FACTOR 1u
/* interrupts per output period (1 = hardware only) */
#define TIMING_SOFT_DIVIDER 1UL
/* interrupts the output stays high */
#define TIMING_HIGH_TICKS 3UL

#endif
