// The reference's own timer tables, typed from the vendors' documents. They
// must not be imported from lib/engine/devices: a wrong entry there has to
// disagree with this file to show.

export interface RefTimer {
  device: "atmega328p" | "attiny85" | "pic12f1840" | "msp430g2553" | "stm32g031" | "rp2040";
  timer: string;
  clockHz: number;
  /** clock cycles per counter step, ascending */
  dividers: number[];
  /** counter steps per hardware period (TOP + 1 and the like) */
  pwm?: { min: number; max: number; factors: number[] };
  toggle?: { min: number; max: number };
  isr?: { min: number; max: number };
  /** smallest pwm high-time step in counter steps */
  highStep: number;
  /** clock cycles per CPU cycle: the 500-cycle interrupt rule counts CPU cycles */
  clocksPerCpuCycle: number;
  /** small enough to enumerate every (divider, count) pair */
  small: boolean;
}

// ATmega328P datasheet DS40002061: CS0/CS1 clock select (clk/1, 8, 64, 256, 1024);
// Timer/Counter2 CS2 (1, 8, 32, 64, 128, 256, 1024). Fast PWM mode 14 on
// Timer1: "the minimum resolution allowed is 2-bit (ICR1 or OCR1A set to
// 0x0003)", so TOP >= 3, 4..65536 counts; 8-bit TOP = OCRnA 0..255.
const AVR5 = [1, 8, 64, 256, 1024];
const AVR_T2 = [1, 8, 32, 64, 128, 256, 1024];
// ATtiny25/45/85 datasheet, Timer/Counter1 prescale select CS13:10: CK/1 .. CK/16384.
const TINY_T1 = [1, 2, 4, 8, 16, 32, 64, 128, 256, 512, 1024, 2048, 4096, 8192, 16384];

/**
 * A pwm output must still switch once per period: high for at least one
 * high-time step and at most the period less one step (common practice, no
 * source: a constant level is not a pulse train). So pwm needs >= 2 steps.
 */
export const TIMERS: RefTimer[] = [
  {
    device: "atmega328p",
    timer: "TIMER1",
    clockHz: 16e6,
    dividers: AVR5,
    pwm: { min: 4, max: 65536, factors: [1] },
    toggle: { min: 1, max: 65536 },
    isr: { min: 1, max: 65536 },
    highStep: 1,
    clocksPerCpuCycle: 1,
    small: true,
  },
  ...(["TIMER0", "TIMER2"] as const).map((timer): RefTimer => ({
    device: "atmega328p",
    timer,
    clockHz: 14.7456e6,
    dividers: timer === "TIMER2" ? AVR_T2 : AVR5,
    pwm: { min: 2, max: 256, factors: [1] },
    toggle: { min: 1, max: 256 },
    isr: { min: 1, max: 256 },
    highStep: 1,
    clocksPerCpuCycle: 1,
    small: true,
  })),
  {
    device: "attiny85",
    timer: "TIMER0",
    clockHz: 8e6,
    dividers: AVR5,
    pwm: { min: 2, max: 256, factors: [1] },
    toggle: { min: 1, max: 256 },
    isr: { min: 1, max: 256 },
    highStep: 1,
    clocksPerCpuCycle: 1,
    small: true,
  },
  {
    device: "attiny85",
    timer: "TIMER1",
    clockHz: 8e6,
    dividers: TINY_T1,
    pwm: { min: 2, max: 256, factors: [1] }, // OCR1C 8-bit TOP
    toggle: { min: 1, max: 256 },
    isr: { min: 1, max: 256 },
    highStep: 1,
    clocksPerCpuCycle: 1,
    small: true,
  },
  // PIC12F1840 datasheet DS40001441: Timer2 counts Fosc/4 through prescale
  // 1, 4, 16, 64; PR2 0..255; PWM duty CCPR1L:DC1B is 10 bits in Tosc *
  // prescale units = quarter Timer2 counts; instruction cycle = 4 Tosc.
  // Timer2 has no output-compare toggle.
  {
    device: "pic12f1840",
    timer: "TIMER2",
    clockHz: 32e6,
    dividers: [4, 16, 64, 256],
    pwm: { min: 1, max: 256, factors: [1] },
    isr: { min: 1, max: 256 },
    highStep: 0.25,
    clocksPerCpuCycle: 4,
    small: true,
  },
  // MSP430x2xx Family User's Guide SLAU144, Timer_A: ID /1 /2 /4 /8, up mode
  // period TACCR0 + 1 with TACCR0 0..65535.
  {
    device: "msp430g2553",
    timer: "TIMER0_A3",
    clockHz: 16e6,
    dividers: [1, 2, 4, 8],
    pwm: { min: 2, max: 65536, factors: [1] },
    toggle: { min: 1, max: 65536 },
    isr: { min: 1, max: 65536 },
    highStep: 1,
    clocksPerCpuCycle: 1,
    small: true,
  },
  // RM0444: CK_CNT = f / (PSC + 1), PSC 0..65535; TIM3 16-bit ARR, TIM2
  // 32-bit ARR; "the counter is blocked while the auto-reload value is null",
  // so ARR >= 1, at least 2 counts.
  {
    device: "stm32g031",
    timer: "TIM3",
    clockHz: 64e6,
    dividers: Array.from({ length: 65536 }, (_, i) => i + 1),
    pwm: { min: 2, max: 65536, factors: [1] },
    toggle: { min: 2, max: 65536 },
    highStep: 1,
    clocksPerCpuCycle: 1,
    small: false,
  },
  // RP2040 datasheet, PWM: divider DIV_INT 1..255 + DIV_FRAC/16; period
  // (TOP + 1) * (PH_CORRECT + 1) * divider / f_sys, TOP 0..65535.
  {
    device: "rp2040",
    timer: "PWM0",
    clockHz: 125e6,
    dividers: Array.from({ length: 255 * 16 }, (_, i) => (16 + i) / 16), // INT 1..255 x FRAC 0..15
    pwm: { min: 2, max: 65536, factors: [1, 2] },
    highStep: 1,
    clocksPerCpuCycle: 1,
    small: false,
  },
];
