/* Timing constants — RP2040 PWM2 isr
 * Retrofit: Ostberg pump house lead-lag timer, revision r3, engine 1.0.0
 * Achieved period 1.000000 s (+0.000 ppm),
 * high time 250.0000 ms (+0.000 ppm).
 * period = (TOP+1) * (PH_CORRECT+1) * DIV * softwareDivider / f_sys
 *        = 62500 * 1 * 250 * 8 / 125000000
 */
#ifndef TIMING_H
#define TIMING_H

#define CLK_SYS_HZ 125000000u
#define XOSC_HZ 12000000u
#define TIMING_SLICE 2u
#define TIMING_GPIO 4u
#define TIMING_PERIOD_COUNTS 62500u
#define TIMING_HIGH_COUNTS 2u
#define TIMING_SOFT_DIVIDER 8u
#define TIMING_HIGH_TICKS 2u

#endif
