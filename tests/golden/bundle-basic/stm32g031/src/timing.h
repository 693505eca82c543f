/* Timing constants — STM32G031 TIM2 pwm
 * Retrofit: Kiln 3 firing stage, revision r2, engine 1.0.0
 * Achieved period 20.00000 ms (+0.000 ppm),
 * high time 1.500000 ms (+0.000 ppm).
 * period = divider * periodCounts * modeFactor * softwareDivider / f_TIM
 *        = 1 * 320000 * 1 * 1 / 16000000
 * f_TIM = SYSCLK: the APB prescaler stays 1 (RM0444, clock tree).
 */
#ifndef TIMING_H
#define TIMING_H

#define SYSCLK_HZ 16000000u
#define TIMING_DIVIDER 1u
#define TIMING_PERIOD_COUNTS 320000u
#define TIMING_HIGH_COUNTS 24000u
#define TIMING_SOFT_DIVIDER 1u

#endif
