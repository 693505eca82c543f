/* Timing constants — STM32G031 TIM3 pwm
 * Retrofit: Ostberg pump house lead-lag timer, revision r3, engine 1.0.0
 * Achieved period 1.000000 ms (+0.000 ppm),
 * high time 250.0000 us (+0.000 ppm).
 * period = divider * periodCounts * modeFactor * softwareDivider / f_TIM
 *        = 1 * 16000 * 1 * 1 / 16000000
 * f_TIM = SYSCLK: the APB prescaler stays 1 (RM0444, clock tree).
 */
#ifndef TIMING_H
#define TIMING_H

#define SYSCLK_HZ 16000000u
#define TIMING_DIVIDER 1u
#define TIMING_PERIOD_COUNTS 16000u
#define TIMING_HIGH_COUNTS 4000u
#define TIMING_SOFT_DIVIDER 1u

#endif
