/* Timing constants — RP2040 PWM0 pwm
 * Retrofit: Ostberg pump house lead-lag timer, revision r1, engine 1.0.0
 * Achieved period 20.00000 ms (+0.000 ppm),
 * high time 1.499840 ms (-106.667 ppm).
 * period = (TOP+1) * (PH_CORRECT+1) * DIV * softwareDivider / f_sys
 *        = 62500 * 2 * 20 * 1 / 125000000
 */
#ifndef TIMING_H
#define TIMING_H

#define CLK_SYS_HZ 125000000u
#define XOSC_HZ 12000000u
#define TIMING_SLICE 0u
#define TIMING_GPIO 0u
#define TIMING_PERIOD_COUNTS 62500u
#define TIMING_HIGH_COUNTS 4687u
#define TIMING_SOFT_DIVIDER 1u

#endif
