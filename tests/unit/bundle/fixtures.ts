// Specs shared by the bundle tests. Periods are chosen so each plan is exact
// on its clock (the solver reports the achieved numbers either way).
import type { BundleSpec, BundleTargetRequest } from "@/lib/bundle";

/** MSP430G2553 at 1 MHz: a 1 ms pulse 4 ms after each input event, in a 20 ms (50 Hz) frame. */
export const msp430TriggerRequest = (
  start: "trigger" | "zero-cross" = "trigger",
  extra: Partial<BundleTargetRequest> = {},
): BundleTargetRequest => ({
  device: "msp430g2553",
  clockHz: 1e6,
  periodS: 0.02,
  highS: 1e-3,
  start,
  delayS: 4e-3,
  ...extra,
});

export const TARGETS: BundleTargetRequest[] = [
  { device: "atmega328p", clockHz: 16e6, periodS: 0.02, highS: 0.0015, mode: "pwm" },
  { device: "atmega328p", clockHz: 16e6, periodS: 0.05, highS: 0.01, mode: "isr" },
  { device: "atmega328p", clockHz: 16e6, periodS: 2e-3, highS: 1e-3, mode: "toggle" },
  { device: "attiny85", clockHz: 8e6, periodS: 2e-3, highS: 0.5e-3, mode: "pwm", timer: "TIMER0" },
  { device: "attiny85", clockHz: 8e6, periodS: 2e-3, highS: 1e-3, mode: "toggle", timer: "TIMER0" },
  { device: "attiny85", clockHz: 8e6, periodS: 1e-3, highS: 0.25e-3, mode: "pwm", timer: "TIMER1" },
  { device: "stm32g031", clockHz: 16e6, periodS: 0.02, highS: 0.0015 },
  { device: "stm32g031", clockHz: 16e6, periodS: 100, highS: 10, mode: "isr" },
  { device: "rp2040", clockHz: 125e6, periodS: 0.02, highS: 0.0015 },
  { device: "rp2040", clockHz: 125e6, periodS: 10, highS: 1, mode: "isr" },
  { device: "pic12f1840", clockHz: 16e6, periodS: 1e-3, highS: 0.25e-3 },
  { device: "pic12f1840", clockHz: 16e6, periodS: 1, highS: 0.25, mode: "isr" },
  { device: "msp430g2553", clockHz: 1e6, periodS: 0.02, highS: 0.0015 },
  { device: "msp430g2553", clockHz: 1e6, periodS: 2, highS: 0.5, mode: "isr" },
];

export function spec(
  targets: BundleTargetRequest[] = TARGETS,
  over: Partial<BundleSpec["retrofit"]> = {},
): BundleSpec {
  return {
    retrofit: {
      name: "Kiln 3 firing stage",
      site: "North plant",
      assetTag: "K3-TS1",
      mainsPowered: true,
      drivesThyristor: true,
      ...over,
    },
    revision: 2,
    // UJT stage of the GE SCR manual kind: values are demo data
    stage: { kind: "ujt", supplyV: 20, timingR: 10e3, timingC: 1e-6, eta: 0.63 },
    targets,
  };
}

/** Folder names buildBundleSources gives TARGETS, in order. */
export const FOLDERS = [
  "atmega328p",
  "atmega328p-2",
  "atmega328p-3",
  "attiny85",
  "attiny85-2",
  "attiny85-3",
  "stm32g031",
  "stm32g031-2",
  "rp2040",
  "rp2040-2",
  "pic12f1840",
  "pic12f1840-2",
  "msp430g2553",
  "msp430g2553-2",
];
