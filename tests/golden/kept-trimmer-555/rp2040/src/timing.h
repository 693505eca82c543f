/* Timing constants — RP2040 PWM0 pwm
 * Retrofit: Ostberg pump house lead-lag timer, revision r1, engine 1.0.0
 * Achieved period 1.455599 ms (-0.716 ppm),
 * high time 762.3698 us (-39.623 ppm).
 * period = (TOP+1) * (PH_CORRECT+1) * DIV * softwareDivider / f_sys
 *        = 11179 * 1 * 1.5625 * 1 / 12000000
 */
#ifndef TIMING_H
#define TIMING_H

#define CLK_SYS_HZ 12000000u
#define XOSC_HZ 12000000u
#define TIMING_SLICE 0u
#define TIMING_GPIO 0u
#define TIMING_PERIOD_COUNTS 11179u
#define TIMING_HIGH_COUNTS 5855u
#define TIMING_SOFT_DIVIDER 1u

/* Calibration constant of the old board's trimmer (trimmer as rb, 4700 ohm track + 8200 ohm in series).
 * Set once on site (CHECKLIST.md, trimmer lines): measure the old board's period as
 * trimmed, TRIM_PERIOD_COUNTS = period / 130.2083 ns rounded (one count of the
 * timer is 130.2083 ns), write it here, rebuild, flash, measure again.
 * It may take 9263..14267: the old stage's period with the trimmer at either end
 * (1.206076 ms .. 1.857634 ms). The value below is the stored rb's.
 */
#define TRIM_PERIOD_COUNTS 11179u
#define TRIM_COUNTS_MIN 9263u
#define TRIM_COUNTS_MAX 14267u
#if TRIM_PERIOD_COUNTS < TRIM_COUNTS_MIN || TRIM_PERIOD_COUNTS > TRIM_COUNTS_MAX
#error "TRIM_PERIOD_COUNTS lies outside the trimmer's range (TRIM_COUNTS_MIN..TRIM_COUNTS_MAX)"
#endif
/* High counts follow the old stage's law through three points (trimmer start, stored value,
 * trimmer end), linear between them, rounded half up. */
#define TRIM_AT_STORED 11179ULL
#define TRIM_HIGH_AT_MIN 4898ULL
#define TRIM_HIGH_AT_STORED 5855ULL
#define TRIM_HIGH_AT_MAX 7399ULL
#define TRIM_LERP(n0, h0, n1, h1) \
  ((h0 * ((n1) - (TRIM_PERIOD_COUNTS)) + h1 * ((TRIM_PERIOD_COUNTS) - (n0)) + ((n1) - (n0)) / 2u) / ((n1) - (n0)))
#if TRIM_PERIOD_COUNTS == 11179
#define TRIM_HIGH_COUNTS TRIM_HIGH_AT_STORED
#elif TRIM_PERIOD_COUNTS < 11179
#define TRIM_HIGH_COUNTS TRIM_LERP(9263ULL, TRIM_HIGH_AT_MIN, TRIM_AT_STORED, TRIM_HIGH_AT_STORED)
#else
#define TRIM_HIGH_COUNTS TRIM_LERP(TRIM_AT_STORED, TRIM_HIGH_AT_STORED, 14267ULL, TRIM_HIGH_AT_MAX)
#endif
#endif
