/* Timing constants — STM32G031 TIM2 isr
 * Retrofit: Ostberg pump house lead-lag timer, revision r1, engine 1.0.0
 * Achieved period 10.00000 ms (+0.000 ppm),
 * high time 100.0000 us (+0.000 ppm).
 * period = divider * periodCounts * modeFactor * softwareDivider / f_TIM
 *        = 1 * 65600 * 1 * 1 / 16000000
 * f_TIM = SYSCLK: the APB prescaler stays 1 (RM0444, clock tree).
 */
#ifndef TIMING_H
#define TIMING_H

#define SYSCLK_HZ 16000000u
#define TIMING_DIVIDER 1u
#define TIMING_PERIOD_COUNTS 65600u
#define TIMING_HIGH_COUNTS 1600u
#define TIMING_SOFT_DIVIDER 1u
#define TIMING_HIGH_TICKS 1600u

#endif
