// ATmega328P. Reference: ATmega48A/PA/88A/PA/168A/PA/328/P datasheet
// (Microchip DS40002061): 16-bit Timer/Counter1 (modes 4 and 14, register
// description), 8-bit Timer/Counter0 and 2, pin configurations (28-pin PDIP),
// system clock and clock options, interrupt response time.
import { avr8bitTimer } from "./avr-8bit";
import { pin, type DeviceSpec, type TimerConfig, type TimerSpec } from "./spec";
import { AVR_COMMON_CLOCKS, AVR_SLOW_AND_EXTERNAL_CLOCKS } from "./avr-clocks";
import { ATMEGA328P_PDIP28 } from "./avr-packages";

const PDIP = "PDIP-28";
// PDIP-28 pinout: PD3 = 5, PD5 = 11, PD6 = 12, PB1 = 15, PB3 = 17.
const PB1_OC1A = pin({ port: "PB1", function: "OC1A", packagePin: 15, package: PDIP, portName: "B", bit: 1 });

// TCCR1A: COM1A1 7, COM1A0 6, WGM11 1; TCCR1B: WGM13 4, WGM12 3, CS12:0.
const CS1: Record<number, number> = { 1: 1, 8: 2, 64: 3, 256: 4, 1024: 5 };
const T1_DIVIDERS = [1, 8, 64, 256, 1024];

const timer1: TimerSpec = {
  name: "TIMER1",
  bits: 16,
  dividers: T1_DIVIDERS,
  isrDividers: T1_DIVIDERS,
  dividerQuantum: 1,
  // Fast PWM with TOP = ICR1: minimum TOP is 0x0003 (2-bit resolution).
  counts: { pwm: { min: 4, max: 65536 }, toggle: { min: 1, max: 65536 }, isr: { min: 1, max: 65536 } },
  modeFactors: { pwm: [1], toggle: [2] },
  highStep: 1,
  pins: { pwm: PB1_OC1A, toggle: PB1_OC1A, isr: { ...PB1_OC1A, function: "GPIO" } },
  registers(c: TimerConfig): Record<string, number> {
    const cs = CS1[c.divider];
    const n = c.periodCounts;
    if (c.mode === "pwm")
      return {
        TCCR1A: (1 << 7) | (1 << 1),
        TCCR1B: (1 << 4) | (1 << 3) | cs,
        ICR1: n - 1,
        OCR1A: c.highCounts - 1,
      };
    if (c.mode === "toggle") return { TCCR1A: 1 << 6, TCCR1B: (1 << 3) | cs, OCR1A: n - 1 };
    return { TCCR1A: 0, TCCR1B: (1 << 3) | cs, OCR1A: n - 1, TIMSK1: 1 << 1 };
  },
};

const CS0 = { 1: 1, 8: 2, 64: 3, 256: 4, 1024: 5 };
const CS2 = { 1: 1, 8: 2, 32: 3, 64: 4, 128: 5, 256: 6, 1024: 7 };

export const atmega328p: DeviceSpec = {
  id: "atmega328p",
  name: "ATmega328P",
  family: "AVR (megaAVR)",
  core: "avr",
  reference: "ATmega328P datasheet, Microchip DS40002061",
  minClockHz: 1e3,
  maxClockHz: 20e6,
  clocksPerCpuCycle: 1,
  // Interrupt response: 4 cycles, plus up to 4 to finish a multi-cycle instruction (from memory).
  isrLatencyCycles: 8,
  isrLatencySource: "datasheet interrupt response time, 4 + 4 cycles (from memory)",
  clocks: [...AVR_COMMON_CLOCKS, ...AVR_SLOW_AND_EXTERNAL_CLOCKS],
  defaultClock: "crystal",
  timers: [
    timer1,
    avr8bitTimer({
      index: 0,
      clockSelect: CS0,
      maskRegister: "TIMSK0",
      maskValue: 1 << 1,
      pinA: pin({ port: "PD6", function: "OC0A", packagePin: 12, package: PDIP, portName: "D", bit: 6 }),
      pinB: pin({ port: "PD5", function: "OC0B", packagePin: 11, package: PDIP, portName: "D", bit: 5 }),
    }),
    avr8bitTimer({
      index: 2,
      clockSelect: CS2,
      maskRegister: "TIMSK2",
      maskValue: 1 << 1,
      pinA: pin({ port: "PB3", function: "OC2A", packagePin: 17, package: PDIP, portName: "B", bit: 3 }),
      pinB: pin({ port: "PD3", function: "OC2B", packagePin: 5, package: PDIP, portName: "D", bit: 3 }),
    }),
  ],
  packages: [ATMEGA328P_PDIP28],
  toolchain: { compiler: "avr-gcc", target: "-mmcu=atmega328p", header: "avr/io.h" },
};
