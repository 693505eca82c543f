// PIC12F1840. Reference: PIC12(L)F1840 datasheet (Microchip DS40001441):
// Timer2 (T2CON, PR2, prescale 1:1/1:4/1:16/1:64), CCP1 PWM mode (period
// (PR2+1)*4*Tosc*prescale, 10-bit duty CCPR1L:DC1B, pulse = DC*Tosc*prescale),
// 8-pin PDIP pin diagram, oscillator module, interrupt latency.
import { pin, type DeviceSpec, type TimerConfig, type TimerSpec } from "./spec";

const PRESCALE: Record<number, number> = { 1: 0, 4: 1, 16: 2, 64: 3 };
// Timer2 counts at Fosc/4 / prescale: the effective divider is 4 * prescale.
const DIVIDERS = [4, 16, 64, 256];
// CCP1/P1A on RA2 (APFCON CCP1SEL = 0), 8-pin PDIP pin 5.
const RA2 = { port: "RA2", packagePin: 5, package: "PDIP-8", portName: "A", bit: 2 };

const timer2: TimerSpec = {
  name: "TIMER2",
  bits: 8,
  dividers: DIVIDERS,
  isrDividers: DIVIDERS,
  dividerQuantum: 1,
  counts: { pwm: { min: 1, max: 256 }, isr: { min: 1, max: 256 } },
  modeFactors: { pwm: [1] },
  // 10-bit duty: two extra bits below PR2, a quarter of a Timer2 count.
  highStep: 0.25,
  pins: { pwm: pin({ ...RA2, function: "CCP1" }), isr: pin({ ...RA2, function: "GPIO" }) },
  registers(c: TimerConfig): Record<string, number> {
    // T2CON: TMR2ON 2, T2CKPS1:0 1..0. CCP1CON: DC1B1:0 5..4, CCP1M3:0 = 1100 (PWM, P1A active high).
    const t2con = (1 << 2) | PRESCALE[c.divider / 4];
    if (c.mode === "pwm") {
      const dc = Math.round(c.highCounts * 4);
      return { T2CON: t2con, PR2: c.periodCounts - 1, CCPR1L: dc >> 2, CCP1CON: 0x0c | ((dc & 3) << 4) };
    }
    // PIE1: TMR2IE 1. INTCON: GIE 7, PEIE 6.
    return { T2CON: t2con, PR2: c.periodCounts - 1, PIE1: 1 << 1, INTCON: 0xc0 };
  },
};

export const pic12f1840: DeviceSpec = {
  id: "pic12f1840",
  name: "PIC12F1840",
  family: "PIC12 (enhanced mid-range)",
  core: "pic",
  reference: "PIC12(L)F1840 datasheet, Microchip DS40001441",
  minClockHz: 31e3,
  maxClockHz: 32e6,
  clocksPerCpuCycle: 4,
  // Interrupt latency 3 to 5 instruction cycles (from memory).
  isrLatencyCycles: 20,
  isrLatencySource: "datasheet interrupt latency, 3-5 instruction cycles (from memory)",
  clocks: [
    {
      id: "crystal",
      label: "Crystal (HS) 4-20 MHz",
      minHz: 4e6,
      maxHz: 20e6,
      accuracyPpm: 50,
      kind: "crystal",
      accuracySource: "common practice",
    },
    {
      id: "crystal-pll",
      label: "Crystal 8 MHz with 4x PLL",
      hz: 32e6,
      accuracyPpm: 50,
      kind: "pll",
      accuracySource: "common practice",
    },
    {
      id: "hfintosc",
      label: "HFINTOSC 16 MHz (or divided)",
      minHz: 31.25e3,
      maxHz: 16e6,
      accuracyPpm: 20000,
      kind: "internal",
      accuracySource: "+-2 %, from memory",
    },
    {
      id: "hfintosc-pll",
      label: "HFINTOSC 8 MHz with 4x PLL",
      hz: 32e6,
      accuracyPpm: 20000,
      kind: "pll",
      accuracySource: "+-2 %, from memory",
    },
    {
      id: "lfintosc",
      label: "LFINTOSC 31 kHz",
      hz: 31e3,
      accuracyPpm: 200000,
      kind: "internal",
      accuracySource: "from memory",
    },
  ],
  defaultClock: "crystal",
  timers: [timer2],
  toolchain: { compiler: "xc8", target: "12F1840", header: "xc.h" },
};
