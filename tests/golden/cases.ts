// The golden bundle set: one bundle per device holding a target for every
// timer and every mode the solver can emit on it (listDevices), plus the
// checklist variants (mains / thyristor cautions on and off).
// scripts/golden-update.ts writes tests/golden/<case>/ from these;
// tests/unit/bundle/golden.test.ts only compares.
import type { BundleSpec, BundleTargetRequest } from "@/lib/bundle";
import { listDevices } from "@/lib/engine";

/** A clock each device runs at on its default package (demo choice). */
const CLOCK_HZ: Record<string, number> = {
  atmega328p: 16e6,
  attiny85: 8e6,
  stm32g031: 16e6,
  rp2040: 125e6,
  pic12f1840: 16e6,
  msp430g2553: 1e6,
};

/** Requests per mode: reachable by every timer at the clocks above (checked by the test). */
const REQUEST = {
  pwm: { periodS: 1e-3, highS: 2.5e-4 },
  toggle: { periodS: 2e-3, highS: 1e-3 },
  isr: { periodS: 1, highS: 0.25 },
} as const;

export interface GoldenCase {
  name: string;
  spec: BundleSpec;
}

const retrofit = (mains: boolean) => ({
  name: "Ostberg pump house lead-lag timer",
  site: "Ostberg Valley Water Board, station 4",
  assetTag: "OVWB-PH4-T2",
  mainsPowered: mains,
  drivesThyristor: mains,
});

export function goldenTargets(device: string): BundleTargetRequest[] {
  const info = listDevices().find((d) => d.id === device)!;
  return info.timers.flatMap((t) =>
    t.modes.map((mode) => ({ device, clockHz: CLOCK_HZ[device], ...REQUEST[mode], mode, timer: t.name })),
  );
}

export const GOLDEN_CASES: GoldenCase[] = [
  ...listDevices().map((d) => ({
    name: d.id,
    spec: {
      retrofit: retrofit(true),
      revision: 3,
      stage: { kind: "ujt" as const, supplyV: 20, timingR: 10e3, timingC: 1e-6, eta: 0.63 },
      targets: goldenTargets(d.id),
    },
  })),
  {
    // low-voltage retrofit: no mains or thyristor cautions; a 555 stage; the solver picks the timer
    name: "low-voltage-555",
    spec: {
      retrofit: retrofit(false),
      revision: 1,
      stage: { kind: "timer555-astable", supplyV: 12, ra: 10e3, rb: 47e3, c: 1e-6 },
      targets: [
        { device: "atmega328p", clockHz: 16e6, periodS: 0.02, highS: 0.0015, mode: "pwm" },
        { device: "rp2040", clockHz: 125e6, periodS: 0.02, highS: 0.0015, mode: "pwm" },
      ],
    },
  },
  {
    // the old 555's Rb is a rate pot (demo values): kept on the AVRs, STM32G031 and RP2040, a note on the MSP430
    name: "kept-pot-555",
    spec: {
      retrofit: retrofit(false),
      revision: 2,
      stage: { kind: "timer555-astable", supplyV: 5, ra: 1e3, rb: 10e3, c: 100e-9 },
      control: { kind: "pot", field: "rb", seriesR: 2.2e3, trackR: 47e3, taper: "linear" },
      targets: [
        { device: "atmega328p", clockHz: 16e6, periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm", timer: "TIMER1" },
        { device: "attiny85", clockHz: 8e6, periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm", timer: "TIMER0" },
        { device: "rp2040", clockHz: 12e6, clockSource: "xosc", periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm" },
        { device: "stm32g031", clockHz: 16e6, periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm" },
{ device: "msp430g2553", clockHz: 1e6, periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm" },
        { device: "pic12f1840", clockHz: 8e6, clockSource: "hfintosc", periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm", timer: "TIMER2" },
      ],
    },
  },
  {
    // the old 555's Rb is a trimmer (demo values): the constant TRIM_PERIOD_COUNTS on five devices, a note on the PIC12F1840
    name: "kept-trimmer-555",
    spec: {
      retrofit: retrofit(false),
      revision: 1,
      stage: { kind: "timer555-astable", supplyV: 5, ra: 1e3, rb: 10e3, c: 100e-9 },
      control: { kind: "trimmer", field: "rb", seriesR: 8.2e3, trackR: 4.7e3 },
      targets: [
        { device: "atmega328p", clockHz: 16e6, periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm", timer: "TIMER1" },
        { device: "attiny85", clockHz: 8e6, periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm", timer: "TIMER0" },
        { device: "rp2040", clockHz: 12e6, clockSource: "xosc", periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm" },
        { device: "stm32g031", clockHz: 16e6, periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm" },
        { device: "msp430g2553", clockHz: 1e6, periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm" },
        { device: "pic12f1840", clockHz: 8e6, clockSource: "hfintosc", periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm", timer: "TIMER2" },
      ],
    },
  },
  {
    // a selector switch of timing capacitors kept on the ATmega328P (inputs PD2..PD4), the ATtiny85 (PB0, PB2, PB3)
    // the RP2040 (GPIO2..GPIO4), the MSP430G2553 (P2.0..P2.2) and the STM32G031 (PA5..PA7)
    name: "kept-selector-555",
    spec: {
      retrofit: retrofit(false),
      revision: 1,
      stage: { kind: "timer555-astable", supplyV: 5, ra: 1e3, rb: 10e3, c: 100e-9 },
      control: { kind: "selector", field: "c", values: [47e-9, 100e-9, 220e-9] },
      targets: [
        { device: "atmega328p", clockHz: 16e6, periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm", timer: "TIMER1" },
        { device: "attiny85", clockHz: 8e6, periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm", timer: "TIMER0" },
        { device: "rp2040", clockHz: 12e6, clockSource: "xosc", periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm" },
        { device: "msp430g2553", clockHz: 1e6, periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm" },
        { device: "stm32g031", clockHz: 16e6, periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm" },
        { device: "pic12f1840", clockHz: 16e6, clockSource: "hfintosc", periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm", timer: "TIMER2" },
      ],
    },
  },
  {
    // mains zero-cross gate firing on both AVRs (50 Hz, both half cycles), with the cautions
    name: "zero-cross-avr",
    spec: {
      retrofit: retrofit(true),
      revision: 1,
      stage: { kind: "ujt" as const, supplyV: 20, timingR: 47e3, timingC: 100e-9, eta: 0.63 },
      targets: [
        { device: "atmega328p", clockHz: 16e6, periodS: 0.01, highS: 1e-4, mode: "isr",
            start: "zero-cross", delayS: 0.004 },
        { device: "attiny85", clockHz: 8e6, periodS: 0.01, highS: 1e-4, mode: "isr",
            start: "zero-cross", delayS: 0.004 },
      ],
    },
  },
  {
    // triggered one-shot from a contact (falling edge), both retrigger rules
    name: "trigger-avr",
    spec: {
      retrofit: retrofit(false),
      revision: 1,
      stage: { kind: "timer555-monostable", r: 100e3, c: 1e-6 },
      targets: [
        {
          device: "atmega328p",
          clockHz: 16e6,
          periodS: 0.5,
          highS: 0.11,
          mode: "isr",
          start: "trigger",
          delayS: 0,
          retrigger: "restart",
        },
        { device: "attiny85", clockHz: 8e6, periodS: 0.5, highS: 0.11, mode: "isr",
          start: "trigger", delayS: 0.01 },
      ],
    },
  },
  {
    // STM32G031: mains zero-cross (both half cycles) and a rising-edge trigger with the ignore rule
    name: "trigger-stm32g031",
    spec: {
      retrofit: retrofit(true),
      revision: 1,
      stage: { kind: "ujt" as const, supplyV: 20, timingR: 47e3, timingC: 100e-9, eta: 0.63 },
      targets: [
        { device: "stm32g031", clockHz: 16e6, periodS: 0.01, highS: 1e-4, mode: "isr",
          start: "zero-cross", delayS: 0.004, edge: "both" },
        { device: "stm32g031", clockHz: 16e6, periodS: 0.02, highS: 0.001, mode: "isr",
          start: "trigger", delayS: 0.004, edge: "rising" },
      ],
    },
  },
  {
    // RP2040: mains zero-cross (both half cycles) and a falling-edge trigger with the restart rule
    name: "trigger-rp2040",
    spec: {
      retrofit: retrofit(true),
      revision: 1,
      stage: { kind: "ujt" as const, supplyV: 20, timingR: 47e3, timingC: 100e-9, eta: 0.63 },
      targets: [
        { device: "rp2040", clockHz: 48e6, periodS: 0.01, highS: 1e-4, mode: "isr",
          start: "zero-cross", delayS: 0.004, edge: "both" },
        { device: "rp2040", clockHz: 12e6, clockSource: "xosc", periodS: 0.02, highS: 0.001, mode: "isr",
          start: "trigger", delayS: 0.004, edge: "falling", retrigger: "restart" },
      ],
    },
  },
  {
    // PIC12F1840: mains zero-cross (both half cycles) and a falling-edge trigger with the restart rule
    name: "trigger-pic12f1840",
    spec: {
      retrofit: retrofit(true),
      revision: 1,
      stage: { kind: "ujt" as const, supplyV: 20, timingR: 47e3, timingC: 100e-9, eta: 0.63 },
      targets: [
        { device: "pic12f1840", clockHz: 4e6, periodS: 0.01, highS: 2e-4, mode: "isr",
          start: "zero-cross", delayS: 0.004, edge: "both" },
        { device: "pic12f1840", clockHz: 4e6, periodS: 0.02, highS: 0.001, mode: "isr",
          start: "trigger", delayS: 0.004, edge: "falling", retrigger: "restart" },
      ],
    },
  },
  {
    // MSP430G2553: mains zero-cross (both half cycles) and a rising-edge trigger with the ignore rule
    name: "trigger-msp430g2553",
    spec: {
      retrofit: retrofit(true),
      revision: 1,
      stage: { kind: "ujt" as const, supplyV: 20, timingR: 47e3, timingC: 100e-9, eta: 0.63 },
      targets: [
        { device: "msp430g2553", clockSource: "dco-cal", clockHz: 1e6, periodS: 0.01, highS: 1e-4,
          mode: "isr", start: "zero-cross", delayS: 0.004, edge: "both" },
        { device: "msp430g2553", clockSource: "dco-cal", clockHz: 8e6, periodS: 0.02, highS: 0.001,
          mode: "isr", start: "trigger", delayS: 0.004, edge: "rising" },
      ],
    },
  },
];

export const GOLDEN_ROOT = new URL("./", import.meta.url).pathname;
