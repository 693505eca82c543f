// The stage and six-device targets the engine, bundle and API parts measure
// (demo data: the UJT firing stage of the demo retrofits, with tolerances so
// that every analysis runs the 10 000-sample Monte Carlo spread).
import type { BundleSpec, BundleTargetRequest } from "@/lib/bundle";
import type { UjtStage } from "@/lib/engine";

export const STAGE: UjtStage = {
  kind: "ujt",
  supplyV: 20,
  timingR: 33e3,
  timingC: 220e-9,
  eta: 0.65,
  tolerances: { timingR: 0.05, timingC: 0.1, eta: [0.08, 0.08] },
};

/**
 * A usual clock per device, from its clock options: crystal 16 MHz, crystal
 * 8 MHz, HSI16 + PLL 64 MHz, XOSC + PLL 125 MHz (the RP2040 SDK default),
 * 8 MHz x 4 PLL, calibrated DCO 16 MHz.
 */
const CLOCKS: [string, string, number][] = [
  ["atmega328p", "crystal", 16e6],
  ["attiny85", "crystal", 8e6],
  ["stm32g031", "hsi16", 64e6],
  ["rp2040", "xosc-pll", 125e6],
  ["pic12f1840", "crystal-pll", 32e6],
  ["msp430g2553", "dco-cal", 16e6],
];

export function deviceClocks(): { device: string; clockSource: string; clockHz: number }[] {
  return CLOCKS.map(([device, clockSource, clockHz]) => ({ device, clockSource, clockHz }));
}

/** One target per device, period and high time of the stage. */
export function sixTargets(periodS: number, highS: number): BundleTargetRequest[] {
  return deviceClocks().map(({ device, clockHz }) => ({ device, clockHz, periodS, highS }));
}

export function sixDeviceSpec(periodS: number, highS: number): BundleSpec {
  return {
    retrofit: {
      name: "Bench firing stage",
      site: "Bench",
      assetTag: "BENCH-1",
      mainsPowered: true,
      drivesThyristor: true,
    },
    revision: 1,
    stage: STAGE,
    targets: sixTargets(periodS, highS),
  };
}
