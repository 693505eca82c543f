// Schmitt-trigger inverter RC oscillator (one gate of a 74HC14 / CD40106B):
// R from output to input, C from input to ground, rail-to-rail output.
// Output high: C charges from VT- to VT+, tH = R C ln((VDD - VT-)/(VDD - VT+));
// output low: C discharges from VT+ to VT-, tL = R C ln(VT+/VT-).
// Source: first-order RC step response (any circuit-analysis textbook);
// thresholds from the logic family's datasheet (74HC14, CD40106B).
import type { SchmittRcStage } from "../stage-types";
import { errorCheck, fmt, invalidStage, running, stopped, type StageModel } from "./model";

export const schmittRcModel: StageModel<SchmittRcStage> = {
  kind: "schmitt-rc",
  label: "Schmitt-trigger inverter RC oscillator",
  outputSignal: "rect-output",
  outputLabel: "Rectangular gate output, high while the capacitor charges",
  fields: [
    { name: "supplyV", label: "Supply voltage VDD", unit: "V", optional: false, range: "positive" },
    { name: "r", label: "Feedback resistor", unit: "Ω", optional: false, range: "positive" },
    { name: "c", label: "Timing capacitor", unit: "F", optional: false, range: "positive" },
    { name: "vtPlus", label: "Positive-going threshold VT+", unit: "V", optional: false, range: "positive" },
    { name: "vtMinus", label: "Negative-going threshold VT−", unit: "V", optional: false, range: "positive" },
  ],
  crossCheck(s) {
    if (s.vtPlus <= s.vtMinus) {
      throw invalidStage(
        "vtPlus",
        `vtPlus (${fmt(s.vtPlus, "V")}) must be above vtMinus (${fmt(s.vtMinus, "V")}).`,
      );
    }
  },
  evaluate(s) {
    if (s.supplyV <= s.vtPlus) {
      return stopped([
        errorCheck(
          "supply-below-trip",
          `The input can rise at most to the supply (${fmt(s.supplyV, "V")}), which does not exceed VT+ (${fmt(s.vtPlus, "V")}): the gate never switches. Check the supply and the thresholds for that supply.`,
          "supplyV",
        ),
      ]);
    }
    if (s.vtPlus <= s.vtMinus) {
      return stopped([
        errorCheck("trip-below-release", "VT+ is not above VT−: no hysteresis, no oscillation.", "vtPlus"),
      ]);
    }
    const highS = s.r * s.c * Math.log((s.supplyV - s.vtMinus) / (s.supplyV - s.vtPlus));
    const lowS = s.r * s.c * Math.log(s.vtPlus / s.vtMinus);
    return running(highS, lowS);
  },
  segments: (s, r) => ({
    unit: "V",
    segments: [
      { from: s.vtMinus, toward: s.supplyV, tauS: s.r * s.c, durationS: r.highS, out: 1 },
      { from: s.vtPlus, toward: 0, tauS: s.r * s.c, durationS: r.lowS, out: 0 },
    ],
  }),
};
