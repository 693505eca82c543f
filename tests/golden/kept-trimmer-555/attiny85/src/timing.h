/* Timing constants — ATtiny85 TIMER0 pwm
 * Retrofit: Ostberg pump house lead-lag timer, revision r1, engine 1.0.0
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

/* Calibration constant of the old board's trimmer (trimmer as rb, 4700 ohm track + 8200 ohm in series).
 * Set once on site (CHECKLIST.md, trimmer lines): measure the old board's period as
 * trimmed, TRIM_PERIOD_COUNTS = period / 8.000000 us rounded (one count of the
 * timer is 8.000000 us), write it here, rebuild, flash, measure again.
 * It may take 151..232: the old stage's period with the trimmer at either end
 * (1.206076 ms .. 1.857634 ms). The value below is the stored rb's.
 */
#define TRIM_PERIOD_COUNTS 182u
#define TRIM_COUNTS_MIN 151u
#define TRIM_COUNTS_MAX 232u
#if TRIM_PERIOD_COUNTS < TRIM_COUNTS_MIN || TRIM_PERIOD_COUNTS > TRIM_COUNTS_MAX
#error "TRIM_PERIOD_COUNTS lies outside the trimmer's range (TRIM_COUNTS_MIN..TRIM_COUNTS_MAX)"
#endif
/* High counts follow the old stage's law through three points (trimmer start, stored value,
 * trimmer end), linear between them, rounded half up. */
#define TRIM_AT_STORED 182ULL
#define TRIM_HIGH_AT_MIN 80ULL
#define TRIM_HIGH_AT_STORED 95ULL
#define TRIM_HIGH_AT_MAX 120ULL
#define TRIM_LERP(n0, h0, n1, h1) \
  ((h0 * ((n1) - (TRIM_PERIOD_COUNTS)) + h1 * ((TRIM_PERIOD_COUNTS) - (n0)) + ((n1) - (n0)) / 2u) / ((n1) - (n0)))
#if TRIM_PERIOD_COUNTS == 182
#define TRIM_HIGH_COUNTS TRIM_HIGH_AT_STORED
#elif TRIM_PERIOD_COUNTS < 182
#define TRIM_HIGH_COUNTS TRIM_LERP(151ULL, TRIM_HIGH_AT_MIN, TRIM_AT_STORED, TRIM_HIGH_AT_STORED)
#else
#define TRIM_HIGH_COUNTS TRIM_LERP(TRIM_AT_STORED, TRIM_HIGH_AT_STORED, 232ULL, TRIM_HIGH_AT_MAX)
#endif
#endif
