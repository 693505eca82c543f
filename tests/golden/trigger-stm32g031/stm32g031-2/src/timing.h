/* Timing constants — STM32G031 TIM2 isr
 * Retrofit: Ostberg pump house lead-lag timer, revision r1, engine 1.0.0
 * Achieved period 20.00000 ms (+0.000 ppm),
 * high time 1.000000 ms (+0.000 ppm).
 * period = divider * periodCounts * modeFactor * softwareDivider / f_TIM
 *        = 1 * 80000 * 1 * 1 / 16000000
 * f_TIM = SYSCLK: the APB prescaler stays 1 (RM0444, clock tree).
 */
#ifndef TIMING_H
#define TIMING_H

#define SYSCLK_HZ 16000000u
#define TIMING_DIVIDER 1u
#define TIMING_PERIOD_COUNTS 80000u
#define TIMING_HIGH_COUNTS 16000u
#define TIMING_SOFT_DIVIDER 1u
#define TIMING_HIGH_TICKS 16000u

#endif
