// ATtiny85. Reference: ATtiny25/45/85 datasheet (Atmel 2586, Microchip
// DS40001911): 8-bit Timer/Counter0, 8-bit Timer/Counter1 (TCCR1, PWM1A,
// CTC1, CS13:10), pin configurations (8-pin PDIP/SOIC), clock sources.
import { avr8bitTimer } from "./avr-8bit";
import { pin, type DeviceSpec, type TimerConfig, type TimerSpec } from "./spec";
import { AVR_COMMON_CLOCKS, AVR_SLOW_AND_EXTERNAL_CLOCKS } from "./avr-clocks";
import { ATTINY85_PDIP8 } from "./avr-packages";

const PDIP = "PDIP-8";
// PDIP-8 pinout: PB0 = 5, PB1 = 6.
const PB0 = { port: "PB0", packagePin: 5, package: PDIP, portName: "B", bit: 0 };
const PB1 = { port: "PB1", packagePin: 6, package: PDIP, portName: "B", bit: 1 };

// Timer1 prescaler: CS13:10 = 0001 -> CK, 0010 -> CK/2 ... 1111 -> CK/16384.
const T1_DIVIDERS = Array.from({ length: 15 }, (_, i) => 2 ** i);
// TCCR1: CTC1 7, PWM1A 6, COM1A1 5, COM1A0 4, CS13:10 3..0. TIMSK: OCIE1A 6, OCIE0A 4.
const timer1: TimerSpec = {
  name: "TIMER1",
  bits: 8,
  dividers: T1_DIVIDERS,
  isrDividers: T1_DIVIDERS,
  dividerQuantum: 1,
  counts: { pwm: { min: 2, max: 256 }, toggle: { min: 1, max: 256 }, isr: { min: 1, max: 256 } },
  modeFactors: { pwm: [1], toggle: [2] },
  highStep: 1,
  pins: {
    pwm: pin({ ...PB1, function: "OC1A" }),
    toggle: pin({ ...PB1, function: "OC1A" }),
    isr: pin({ ...PB1, function: "GPIO" }),
  },
  registers(c: TimerConfig): Record<string, number> {
    const cs = Math.log2(c.divider) + 1;
    const n = c.periodCounts;
    if (c.mode === "pwm") return { TCCR1: (1 << 6) | (1 << 5) | cs, OCR1C: n - 1, OCR1A: c.highCounts - 1 };
    if (c.mode === "toggle") return { TCCR1: (1 << 7) | (1 << 4) | cs, OCR1C: n - 1, OCR1A: n - 1 };
    return { TCCR1: (1 << 7) | cs, OCR1C: n - 1, OCR1A: n - 1, TIMSK: 1 << 6 };
  },
  notes: (c) =>
    c.mode === "pwm"
      ? [
          "Timer1 PWM1A high time taken as OCR1A + 1 counts, as the megaAVR fast PWM (from memory): check on the bench.",
        ]
      : [],
};

export const attiny85: DeviceSpec = {
  id: "attiny85",
  name: "ATtiny85",
  family: "AVR (tinyAVR)",
  core: "avr",
  reference: "ATtiny25/45/85 datasheet, Atmel 2586 / Microchip DS40001911",
  minClockHz: 1e3,
  maxClockHz: 20e6,
  clocksPerCpuCycle: 1,
  isrLatencyCycles: 8,
  isrLatencySource: "datasheet interrupt response time, 4 + 4 cycles (from memory)",
  clocks: [
    ...AVR_COMMON_CLOCKS,
    {
      id: "pll16m",
      label: "Internal PLL 16 MHz (from the RC oscillator)",
      hz: 16e6,
      accuracyPpm: 100000,
      kind: "pll",
      accuracySource: "follows the RC oscillator, from memory",
    },
    ...AVR_SLOW_AND_EXTERNAL_CLOCKS,
  ],
  defaultClock: "crystal",
  timers: [
    avr8bitTimer({
      index: 0,
      clockSelect: { 1: 1, 8: 2, 64: 3, 256: 4, 1024: 5 },
      maskRegister: "TIMSK",
      maskValue: 1 << 4,
      pinA: pin({ ...PB0, function: "OC0A" }),
      pinB: pin({ ...PB1, function: "OC0B" }),
    }),
    timer1,
  ],
  packages: [ATTINY85_PDIP8],
  toolchain: { compiler: "avr-gcc", target: "-mmcu=attiny85", header: "avr/io.h" },
};
