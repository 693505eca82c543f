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

/** One target per device on a clock each device's clock options offer; period and high time of the stage. */
export function sixTargets(periodS: number, highS: number): BundleTargetRequest[] {
  const clocks: [string, number][] = [
    ["atmega328p", 16e6],
    ["attiny85", 8e6],
    ["stm32g031", 16e6],
    ["rp2040", 125e6],
    ["pic12f1840", 32e6],
    ["msp430g2553", 16e6],
  ];
  return clocks.map(([device, clockHz]) => ({ device, clockHz, periodS, highS }));
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
