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

#endif
