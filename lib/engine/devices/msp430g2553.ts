// MSP430G2553. Reference: MSP430x2xx Family User's Guide (TI SLAU144),
// Timer_A chapter (TACTL TASSEL/ID/MC, TACCTLx OUTMOD, up mode period
// TACCR0+1), and the MSP430G2x53 datasheet (TI SLAS735) for the 20-pin PDIP
// pinout, P1.2 = TA0.1 (P1SEL = 1, P1SEL2 = 0) and the calibrated DCO.
import { pin, type DeviceSpec, type TimerConfig, type TimerSpec } from "./spec";

const ID: Record<number, number> = { 1: 0, 2: 1, 4: 2, 8: 3 };
const P12 = { port: "P1.2", packagePin: 4, package: "PDIP-20", portName: "1", bit: 2 };

const timerA0: TimerSpec = {
  name: "TIMER0_A3",
  bits: 16,
  dividers: [1, 2, 4, 8],
  isrDividers: [1, 2, 4, 8],
  dividerQuantum: 1,
  counts: { pwm: { min: 2, max: 65536 }, toggle: { min: 1, max: 65536 }, isr: { min: 1, max: 65536 } },
  modeFactors: { pwm: [1], toggle: [2] },
  highStep: 1,
  pins: {
    pwm: pin({ ...P12, function: "TA0.1", sel: 1, sel2: 0 }),
    toggle: pin({ ...P12, function: "TA0.1", sel: 1, sel2: 0 }),
    isr: pin({ ...P12, function: "GPIO", sel: 0, sel2: 0 }),
  },
  registers(c: TimerConfig): Record<string, number> {
    // TACTL: TASSEL 9..8 (2 = SMCLK), ID 7..6, MC 5..4 (1 = up). TACCTLx: OUTMOD 7..5, CCIE 4.
    const tactl = (2 << 8) | (ID[c.divider] << 6) | (1 << 4);
    const n = c.periodCounts;
    if (c.mode === "pwm") return { TACTL: tactl, TACCR0: n - 1, TACCR1: c.highCounts, TACCTL1: 7 << 5 };
    if (c.mode === "toggle") return { TACTL: tactl, TACCR0: n - 1, TACCR1: 0, TACCTL1: 4 << 5 };
    return { TACTL: tactl, TACCR0: n - 1, TACCTL0: 1 << 4 };
  },
};

export const msp430g2553: DeviceSpec = {
  id: "msp430g2553",
  name: "MSP430G2553",
  family: "MSP430 (Value Line)",
  core: "msp430",
  reference: "MSP430x2xx Family User's Guide (SLAU144); MSP430G2x53 datasheet (SLAS735)",
  minClockHz: 1e3,
  maxClockHz: 16e6,
  clocksPerCpuCycle: 1,
  // Interrupt acceptance 6 cycles after the current instruction (up to 6 cycles) (from memory).
  isrLatencyCycles: 12,
  isrLatencySource: "family guide interrupt acceptance, 6 cycles + longest instruction (from memory)",
  clocks: [
    {
      id: "dco-cal",
      label: "DCO with factory calibration (1, 8, 12, 16 MHz)",
      minHz: 1e6,
      maxHz: 16e6,
      accuracyPpm: 30000,
      kind: "internal",
      accuracySource: "+-3 %, from memory",
    },
    {
      id: "lfxt1",
      label: "LFXT1 32.768 kHz watch crystal",
      hz: 32768,
      accuracyPpm: 20,
      kind: "crystal",
      accuracySource: "common practice",
    },
    {
      id: "external",
      label: "External digital clock on XIN",
      minHz: 1e3,
      maxHz: 16e6,
      accuracyPpm: 50,
      kind: "external",
      accuracySource: "common practice",
    },
    {
      id: "vlo",
      label: "VLO about 12 kHz",
      hz: 12e3,
      accuracyPpm: 500000,
      kind: "internal",
      accuracySource: "from memory",
    },
  ],
  defaultClock: "dco-cal",
  timers: [timerA0],
  toolchain: { compiler: "msp430-gcc", target: "-mmcu=msp430g2553", header: "msp430.h" },
};
