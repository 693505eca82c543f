// Generic threshold (relaxation) stage: C charges through R from the supply; a
// switching element fires at the trip voltage Vp and discharges C through Rd
// down to the release voltage Vv, with R still feeding. Covers neon lamps
// (striking / extinction voltage), DIAC/SIDAC and light-coupled trip stages.
// Source: first-order RC step response, any circuit-analysis textbook
// (e.g. Hayt & Kemmerly, Engineering Circuit Analysis, first-order circuits).
import type { ThresholdStage } from "../stage-types";
import {
  errorCheck,
  fmt,
  invalidStage,
  running,
  stopped,
  type ModelResult,
  type RcSegment,
  type StageModel,
} from "./model";

export interface RelaxationInput {
  supplyV: number;
  r: number;
  c: number;
  peakV: number;
  valleyV: number;
  dischargeR: number;
}

/** Settling voltage and time constant of the discharge (R feeds, Rd drains). */
export function dischargeEndpoint(x: RelaxationInput) {
  const vinf = (x.supplyV * x.dischargeR) / (x.r + x.dischargeR);
  const tau = (x.c * x.r * x.dischargeR) / (x.r + x.dischargeR);
  return { vinf, tau };
}

/**
 * tc = R C ln((Vs - Vv)/(Vs - Vp)); td = tau ln((Vp - Vinf)/(Vv - Vinf)).
 * highS is the discharge (the output pulse), lowS the charge.
 * `fields` names the inputs behind supply, trip and release for the messages.
 */
export function relaxation(
  x: RelaxationInput,
  fields = { supply: "supplyV", r: "timingR", peak: "peakV", valley: "valleyV", discharge: "dischargeR" },
): ModelResult {
  if (x.peakV <= x.valleyV) {
    return stopped([
      errorCheck(
        "trip-below-release",
        `The trip voltage (${fmt(x.peakV, "V")}) is not above the release voltage (${fmt(x.valleyV, "V")}): the element never switches off and on in turn. Check the device data.`,
        fields.peak,
      ),
    ]);
  }
  if (x.supplyV <= x.peakV) {
    return stopped([
      errorCheck(
        "supply-below-trip",
        `The capacitor can charge at most to the supply (${fmt(x.supplyV, "V")}), which does not exceed the trip voltage (${fmt(x.peakV, "V")}): the stage never fires. Raise the supply or lower the trip voltage.`,
        fields.supply,
      ),
    ]);
  }
  const { vinf, tau } = dischargeEndpoint(x);
  if (vinf >= x.valleyV) {
    return stopped([
      errorCheck(
        "latches",
        `With the timing resistor still feeding, the discharge settles at ${fmt(vinf, "V")}, not below the release voltage (${fmt(x.valleyV, "V")}): the element stays on (latch-up). Make the timing resistor larger or the discharge resistor smaller.`,
        fields.r,
      ),
    ]);
  }
  const lowS = x.r * x.c * Math.log((x.supplyV - x.valleyV) / (x.supplyV - x.peakV));
  const highS = tau * Math.log((x.peakV - vinf) / (x.valleyV - vinf));
  return running(highS, lowS);
}

export function relaxationSegments(x: RelaxationInput, result: ModelResult): RcSegment[] {
  const { vinf, tau } = dischargeEndpoint(x);
  return [
    { from: x.valleyV, toward: x.supplyV, tauS: x.r * x.c, durationS: result.lowS, out: 0 },
    { from: x.peakV, toward: vinf, tauS: tau, durationS: result.highS, out: 1 },
  ];
}

const input = (s: ThresholdStage): RelaxationInput => ({
  supplyV: s.supplyV,
  r: s.timingR,
  c: s.timingC,
  peakV: s.peakV,
  valleyV: s.valleyV,
  dischargeR: s.dischargeR,
});

export const thresholdModel: StageModel<ThresholdStage> = {
  kind: "threshold",
  label: "Threshold relaxation stage (neon, DIAC, light-coupled)",
  outputSignal: "pulse-discharge",
  outputLabel: "Pulse across the discharge resistor while the capacitor discharges",
  fields: [
    { name: "supplyV", label: "Supply voltage", unit: "V", optional: false, range: "positive" },
    { name: "timingR", label: "Timing resistor", unit: "Ω", optional: false, range: "positive" },
    { name: "timingC", label: "Timing capacitor", unit: "F", optional: false, range: "positive" },
    { name: "peakV", label: "Trip (peak) voltage", unit: "V", optional: false, range: "positive" },
    { name: "valleyV", label: "Release (valley) voltage", unit: "V", optional: false, range: "nonNegative" },
    { name: "dischargeR", label: "Discharge resistor", unit: "Ω", optional: false, range: "positive" },
  ],
  crossCheck(s) {
    if (s.peakV <= s.valleyV) {
      throw invalidStage(
        "peakV",
        `peakV (${fmt(s.peakV, "V")}) must be above valleyV (${fmt(s.valleyV, "V")}).`,
      );
    }
  },
  evaluate: (s) => relaxation(input(s)),
  segments: (s, r) => ({ unit: "V", segments: relaxationSegments(input(s), r) }),
};
