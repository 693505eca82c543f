/* MSP430G2553: the old stage's selector switch kept on input pins of port 2.
 * Control: selector on c; 3 positions, one input per position
 * (P2REN pull resistor with P2OUT = 1: pull-up; the switch's common contact to ground,
 * so the selected position reads low), debounced over 20 samples about 1 ms apart.
 * While no position or more than one reads low (the switch between contacts), the output keeps the last position's timing.
 * Only TA0CCR0 and TA0CCR1 change per position; the table's input divider is ID = 1.
 * Register bits: SLAU144, Digital I/O (PxDIR, PxREN, PxOUT, PxSEL, PxIN) and Timer_A chapters.
 * main.c calls selector_control_init() after its own set-up and selector_control_poll() in its loop.
 */
#ifndef SELECTOR_CONTROL_H
#define SELECTOR_CONTROL_H
#include <msp430.h>
#include <stdint.h>

#define SEL_POSITIONS 3u
#define SEL_MASK 0x07u
#define SEL_DEBOUNCE_MS 20u
#define SEL_NONE 0xFFu
/* 1 ms of MCLK (1.000000 MHz) in turns of dec.w + jnz, 3 cycles a turn (SLAU144 instruction cycles; from memory). */
#define SEL_LOOPS_PER_MS 333u

/* Port 2 bit, TA0CCR0 (period counts - 1) and TA0CCR1 (high counts) per position. */
static const uint8_t sel_bit[SEL_POSITIONS] = {
  0u, /* position 1 */
  1u, /* position 2 */
  2u, /* position 3 */
};
static const uint16_t sel_ccr0[SEL_POSITIONS] = {
  683u,
  1455u,
  3201u,
};
static const uint16_t sel_ccr1[SEL_POSITIONS] = {
  358u,
  762u,
  1677u,
};

static uint8_t sel_now;

/* The position whose contact reads low; SEL_NONE when none or more than one does. */
static uint8_t sel_read(void)
{
  uint8_t low = (uint8_t)(~P2IN & SEL_MASK);
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

/* In up mode a TACCR0 below the running count makes the timer roll to zero at once, so
 * both compare registers are written just after the period restarts (CCIFG of TACCR0). */
static void sel_apply(uint8_t i)
{
  TA0CCTL0 &= (uint16_t)~CCIFG;
  while (!(TA0CCTL0 & CCIFG)) {
  }
  TA0CCR0 = sel_ccr0[i];
  TA0CCR1 = sel_ccr1[i];
  sel_now = i;
}

static void sel_wait_ms(void)
{
  uint16_t n = SEL_LOOPS_PER_MS;
  __asm__ volatile("1: dec.w %0\n\tjnz 1b" : "+r"(n));
}

/* One reading that stayed the same for SEL_DEBOUNCE_MS samples 1 ms apart. */
static uint8_t sel_debounced(void)
{
  uint8_t seen = sel_read();
  uint8_t same = 0;
  while (same < SEL_DEBOUNCE_MS) {
    sel_wait_ms();
    uint8_t now = sel_read();
    if (now == seen) {
      same++;
    } else {
      seen = now;
      same = 0;
    }
  }
  return seen;
}

static void selector_control_init(void)
{
  /* Inputs: PxSEL = 0 (I/O), PxDIR = 0, PxREN = 1 with PxOUT = 1: pull-up. */
  P2SEL &= (uint8_t)~SEL_MASK;
  P2DIR &= (uint8_t)~SEL_MASK;
  P2OUT |= SEL_MASK;
  P2REN |= SEL_MASK;
  /* The table's input divider (its longest position), which main.c's fixed plan may not share. */
  TA0CTL = (uint16_t)((TA0CTL & (uint16_t)~ID_3) | ID_0 | TACLR);
  uint8_t first = sel_debounced();
  sel_apply(first == SEL_NONE ? 1u : first); /* no contact: the stored value's position */
}

static void selector_control_poll(void)
{
  uint8_t s = sel_debounced();
  if (s != SEL_NONE && s != sel_now) {
    sel_apply(s);
  }
}

#endif
