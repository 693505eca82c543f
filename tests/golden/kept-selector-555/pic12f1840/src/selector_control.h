/* PIC12F1840: the old stage's selector switch kept on RA4, RA5, RA1.
 * Control: selector on c; 3 positions, one input per position (weak pull-up,
 * WPUA with OPTION_REG nWPUEN = 0; the switch's common contact to ground, so the selected
 * position reads low), digital inputs (ANSELA bits clear), debounced over 20 samples
 * about 1 ms apart. While no position or more than one reads low (the switch between contacts), the output keeps the last position's timing.
 * The same steps as src/selector_control.inc (the image); for builds with the vendor's C compiler.
 * Register bits: DS40001441, I/O Ports, Timer2 and CCP chapters.
 */
#ifndef SELECTOR_CONTROL_H
#define SELECTOR_CONTROL_H
#include <xc.h>
#include <stdint.h>

#define SEL_POSITIONS 3u
#define SEL_MASK 0x32u
#define SEL_NONE 0xFFu

/* RA bit, PR2 (period counts - 1) and CCPR1L (high counts) per position. */
static const uint8_t sel_bit[SEL_POSITIONS] = {
  4u, /* position 1 */
  5u, /* position 2 */
  1u, /* position 3 */
};
static const uint8_t sel_pr2[SEL_POSITIONS] = {
  42u,
  90u,
  199u,
};
static const uint8_t sel_ccpr1l[SEL_POSITIONS] = {
  22u,
  48u,
  105u,
};

static uint8_t sel_now, sel_cand, sel_cnt;

static uint8_t sel_read(void)
{
  uint8_t low = (uint8_t)(~PORTA & SEL_MASK);
  uint8_t found = SEL_NONE;
  for (uint8_t i = 0; i < SEL_POSITIONS; i++) {
    if (low & (uint8_t)(1u << sel_bit[i])) {
      if (found != SEL_NONE) {
        return SEL_NONE;
      }
      found = i;
    }
  }
  return found;
}

/* CCPR1L is latched at the end of the period; PR2 is not buffered: written just after TMR2IF. */
static void sel_apply(uint8_t i)
{
  CCPR1L = sel_ccpr1l[i];
  PIR1bits.TMR2IF = 0;
  while (!PIR1bits.TMR2IF) {
  }
  PR2 = sel_pr2[i];
}

/* At least 1 ms: the assembly's 1333 turns; a compiled turn takes 3 cycles or more,
 * so the C build's debounce may run longer (only the assembly image is timed in gpsim). */
static void sel_ms(void)
{
  for (volatile uint16_t n = 1333u; n; n--) {
  }
}

static void selector_control_init(void)
{
  ANSELA &= (uint8_t)~SEL_MASK;
  TRISA |= SEL_MASK;
  WPUA = SEL_MASK;
  OPTION_REG &= 0x7Fu; /* nWPUEN = 0 */
  T2CON = 0x07u;   /* TMR2ON = 1, prescale 1:64 */
  CCP1CON = 0x0Cu;     /* PWM, DC1B = 00 */
  sel_now = 1u;
  sel_apply(sel_now);
  sel_cand = 0xFEu;
  sel_cnt = 0;
}

static void selector_control_poll(void)
{
  sel_ms();
  uint8_t r = sel_read();
  if (r != sel_cand) {
    sel_cand = r;
    sel_cnt = 20u;
    return;
  }
  if (sel_cnt == 0 || --sel_cnt != 0) {
    return;
  }
  if (sel_cand != SEL_NONE && sel_cand != sel_now) {
    sel_now = sel_cand;
    sel_apply(sel_now);
  }
}
#endif
