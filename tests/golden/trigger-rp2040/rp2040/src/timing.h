/* Timing constants — RP2040 PWM0 isr
 * Retrofit: Ostberg pump house lead-lag timer, revision r1, engine 1.0.0
 * Achieved period 10.00000 ms (+0.000 ppm),
 * high time 100.0000 us (+0.000 ppm).
 * period = (TOP+1) * (PH_CORRECT+1) * DIV * softwareDivider / f_sys
 *        = 49200 * 1 * 4 * 1 / 48000000
 */
#ifndef TIMING_H
#define TIMING_H

#define CLK_SYS_HZ 48000000u
#define XOSC_HZ 12000000u
#define TIMING_SLICE 0u
#define TIMING_GPIO 0u
#define TIMING_PERIOD_COUNTS 49200u
#define TIMING_HIGH_COUNTS 1200u
#define TIMING_SOFT_DIVIDER 1u
#define TIMING_HIGH_TICKS 1200u

#endif
