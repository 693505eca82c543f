/* Timing constants — RP2040 PWM3 pwm
 * Retrofit: Ostberg pump house lead-lag timer, revision r3, engine 1.0.0
 * Achieved period 1.000000 ms (+0.000 ppm),
 * high time 250.0000 us (+0.000 ppm).
 * period = (TOP+1) * (PH_CORRECT+1) * DIV * softwareDivider / f_sys
 *        = 62500 * 2 * 1 * 1 / 125000000
 */
#ifndef TIMING_H
#define TIMING_H

#define CLK_SYS_HZ 125000000u
#define XOSC_HZ 12000000u
#define TIMING_SLICE 3u
#define TIMING_GPIO 6u
#define TIMING_PERIOD_COUNTS 62500u
#define TIMING_HIGH_COUNTS 15625u
#define TIMING_SOFT_DIVIDER 1u

#endif
