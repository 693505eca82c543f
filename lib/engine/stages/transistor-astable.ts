// Two-transistor astable multivibrator. Output at Q1's collector: high while
// Q1 is off. Q1's base is pushed to VBE - (Vcc - VCEsat) when Q2 turns on and
// charges through R1 toward Vcc until it reaches VBE:
// t1 = R1 C1 ln((2 Vcc - VBE - VCEsat)/(Vcc - VBE)) (-> ln 2 R1 C1 when Vcc >> VBE),
// likewise t2 with R2, C2. Source: Millman & Halkias, Integrated Electronics,
// multivibrator chapter (from memory); first-order RC step response.
import type { TransistorAstableStage } from "../stage-types";
import { errorCheck, fmt, running, stopped, warningCheck, type StageModel } from "./model";

export const TRANSISTOR_VBE = 0.65;
export const TRANSISTOR_VCESAT = 0.1;

export function halfPeriod(supplyV: number, r: number, c: number): number {
  return r * c * Math.log((2 * supplyV - TRANSISTOR_VBE - TRANSISTOR_VCESAT) / (supplyV - TRANSISTOR_VBE));
}

export const transistorAstableModel: StageModel<TransistorAstableStage> = {
  kind: "transistor-astable",
  label: "Two-transistor astable multivibrator",
  outputSignal: "rect-output",
  outputLabel: "Rectangular output at Q1's collector, high for the R1·C1 half",
  fields: [
    { name: "supplyV", label: "Supply voltage", unit: "V", optional: false, range: "positive" },
    { name: "r1", label: "Base resistor R1 (Q1)", unit: "Ω", optional: false, range: "positive" },
    {
      name: "c1",
      label: "Coupling capacitor C1 (to Q1 base)",
      unit: "F",
      optional: false,
      range: "positive",
    },
    { name: "r2", label: "Base resistor R2 (Q2)", unit: "Ω", optional: false, range: "positive" },
    {
      name: "c2",
      label: "Coupling capacitor C2 (to Q2 base)",
      unit: "F",
      optional: false,
      range: "positive",
    },
  ],
  evaluate(s) {
    if (s.supplyV <= TRANSISTOR_VBE) {
      return stopped([
        errorCheck(
          "supply-below-trip",
          `Supply ${fmt(s.supplyV, "V")} does not exceed the base-emitter voltage (${fmt(TRANSISTOR_VBE, "V")}): the transistors never turn on. Raise the supply.`,
          "supplyV",
        ),
      ]);
    }
    return running(halfPeriod(s.supplyV, s.r1, s.c1), halfPeriod(s.supplyV, s.r2, s.c2));
  },
  warnings(s) {
    // Each base swings to -(Vcc - VCEsat - VBE); small-signal transistors are
    // rated for about 5..6 V reverse base-emitter (e.g. 2N3904 VEBO 6 V, from memory).
    const reverse = s.supplyV - TRANSISTOR_VCESAT - TRANSISTOR_VBE;
    if (reverse > 5) {
      return [
        warningCheck(
          "base-reverse-voltage",
          `The off transistor's base is driven to about −${fmt(reverse, "V")}, beyond the usual 5 V base-emitter rating: the timing drifts as the junction breaks down. Measure the old board rather than trust the formula.`,
          "supplyV",
        ),
      ];
    }
    return [];
  },
  segments(s, r) {
    const low = TRANSISTOR_VBE - (s.supplyV - TRANSISTOR_VCESAT);
    return {
      unit: "V",
      segments: [
        { from: low, toward: s.supplyV, tauS: s.r1 * s.c1, durationS: r.highS, out: 1 },
        { from: TRANSISTOR_VBE, toward: TRANSISTOR_VBE, tauS: 0, durationS: r.lowS, out: 0 },
      ],
    };
  },
};
