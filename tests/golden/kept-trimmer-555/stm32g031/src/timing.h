/* Timing constants — STM32G031 TIM2 pwm
 * Retrofit: Ostberg pump house lead-lag timer, revision r1, engine 1.0.0
 * Achieved period 1.455625 ms (+17.175 ppm),
 * high time 762.3750 us (-32.791 ppm).
 * period = divider * periodCounts * modeFactor * softwareDivider / f_TIM
 *        = 1 * 23290 * 1 * 1 / 16000000
 * f_TIM = SYSCLK: the APB prescaler stays 1 (RM0444, clock tree).
 */
#ifndef TIMING_H
#define TIMING_H

#define SYSCLK_HZ 16000000u
#define TIMING_DIVIDER 1u
#define TIMING_PERIOD_COUNTS 23290u
#define TIMING_HIGH_COUNTS 12198u
#define TIMING_SOFT_DIVIDER 1u

/* Calibration constant of the old board's trimmer (trimmer as rb, 4700 ohm track + 8200 ohm in series).
 * Set once on site (CHECKLIST.md, trimmer lines): measure the old board's period as
 * trimmed, TRIM_PERIOD_COUNTS = period / 62.50000 ns rounded (one count of the
 * timer is 62.50000 ns), write it here, rebuild, flash, measure again.
 * It may take 19297..29722: the old stage's period with the trimmer at either end
 * (1.206076 ms .. 1.857634 ms). The value below is the stored rb's.
 */
#define TRIM_PERIOD_COUNTS 23290u
#define TRIM_COUNTS_MIN 19297u
#define TRIM_COUNTS_MAX 29722u
#if TRIM_PERIOD_COUNTS < TRIM_COUNTS_MIN || TRIM_PERIOD_COUNTS > TRIM_COUNTS_MAX
#error "TRIM_PERIOD_COUNTS lies outside the trimmer's range (TRIM_COUNTS_MIN..TRIM_COUNTS_MAX)"
#endif
/* High counts follow the old stage's law through three points (trimmer start, stored value,
 * trimmer end), linear between them, rounded half up. */
#define TRIM_AT_STORED 23290ULL
#define TRIM_HIGH_AT_MIN 10203ULL
#define TRIM_HIGH_AT_STORED 12198ULL
#define TRIM_HIGH_AT_MAX 15416ULL
#define TRIM_LERP(n0, h0, n1, h1) \
  ((h0 * ((n1) - (TRIM_PERIOD_COUNTS)) + h1 * ((TRIM_PERIOD_COUNTS) - (n0)) + ((n1) - (n0)) / 2u) / ((n1) - (n0)))
#if TRIM_PERIOD_COUNTS == 23290
#define TRIM_HIGH_COUNTS TRIM_HIGH_AT_STORED
#elif TRIM_PERIOD_COUNTS < 23290
#define TRIM_HIGH_COUNTS TRIM_LERP(19297ULL, TRIM_HIGH_AT_MIN, TRIM_AT_STORED, TRIM_HIGH_AT_STORED)
#else
#define TRIM_HIGH_COUNTS TRIM_LERP(TRIM_AT_STORED, TRIM_HIGH_AT_STORED, 29722ULL, TRIM_HIGH_AT_MAX)
#endif
#endif
