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

#endif
