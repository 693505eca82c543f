/* Timing constants — RP2040 PWM0 isr
 * Retrofit: Ostberg pump house lead-lag timer, revision r1, engine 1.0.0
 * Achieved period 20.00000 ms (+0.000 ppm),
 * high time 1.000000 ms (+0.000 ppm).
 * period = (TOP+1) * (PH_CORRECT+1) * DIV * softwareDivider / f_sys
 *        = 60000 * 1 * 1 * 1 / 12000000
 */
#ifndef TIMING_H
#define TIMING_H

#define CLK_SYS_HZ 12000000u
#define XOSC_HZ 12000000u
#define TIMING_SLICE 0u
#define TIMING_GPIO 0u
#define TIMING_PERIOD_COUNTS 60000u
#define TIMING_HIGH_COUNTS 12000u
#define TIMING_SOFT_DIVIDER 1u
#define TIMING_HIGH_TICKS 12000u

#endif
