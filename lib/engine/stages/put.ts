// PUT (programmable unijunction, e.g. 2N6027) relaxation oscillator: the gate
// divider RB1 (to the supply) / RB2 (to ground) sets the trip voltage
// Vp = Vs*RB2/(RB1 + RB2) + VAK; C discharges through the cathode resistor.
// Source: ON Semiconductor 2N6027/2N6028 datasheet (peak-point definition and
// the same load-line condition as a UJT; from memory); first-order RC timing.
import type { PutStage } from "../stage-types";
import { relaxationSegments, type RelaxationInput } from "./threshold";
import { negativeResistanceStage } from "./ujt";
import type { ModelResult, StageModel } from "./model";

export const PUT_DEFAULTS = {
  offsetV: 0.7,
  valleyV: 1.0,
  peakCurrentA: 2e-6,
  valleyCurrentA: 70e-6,
  dischargeR: 47,
};

export function putPeakV(s: PutStage): number {
  const gateV = (s.supplyV * s.gateLowerR) / (s.gateUpperR + s.gateLowerR);
  return gateV + (s.offsetV ?? PUT_DEFAULTS.offsetV);
}

export function putInput(s: PutStage): RelaxationInput {
  return {
    supplyV: s.supplyV,
    r: s.timingR,
    c: s.timingC,
    peakV: putPeakV(s),
    valleyV: s.valleyV ?? PUT_DEFAULTS.valleyV,
    dischargeR: s.dischargeR ?? PUT_DEFAULTS.dischargeR,
  };
}

const FIELDS = {
  supply: "supplyV",
  r: "timingR",
  peak: "gateLowerR",
  valley: "valleyV",
  discharge: "dischargeR",
};

function evaluate(s: PutStage): ModelResult {
  return negativeResistanceStage(
    putInput(s),
    {
      peakA: s.peakCurrentA ?? PUT_DEFAULTS.peakCurrentA,
      valleyA: s.valleyCurrentA ?? PUT_DEFAULTS.valleyCurrentA,
    },
    "PUT",
    FIELDS,
  );
}

export const putModel: StageModel<PutStage> = {
  kind: "put",
  label: "PUT relaxation oscillator",
  outputSignal: "pulse-cathode",
  outputLabel: "Short positive pulse across the cathode resistor, e.g. to a thyristor gate",
  fields: [
    { name: "supplyV", label: "Supply voltage", unit: "V", optional: false, range: "positive" },
    { name: "timingR", label: "Timing resistor", unit: "Ω", optional: false, range: "positive" },
    { name: "timingC", label: "Timing capacitor", unit: "F", optional: false, range: "positive" },
    {
      name: "gateUpperR",
      label: "Gate resistor to supply (RB1)",
      unit: "Ω",
      optional: false,
      range: "positive",
    },
    {
      name: "gateLowerR",
      label: "Gate resistor to ground (RB2)",
      unit: "Ω",
      optional: false,
      range: "positive",
    },
    {
      name: "offsetV",
      label: "Anode-gate offset VAK",
      unit: "V",
      optional: true,
      default: PUT_DEFAULTS.offsetV,
      range: "nonNegative",
    },
    {
      name: "valleyV",
      label: "Valley voltage",
      unit: "V",
      optional: true,
      default: PUT_DEFAULTS.valleyV,
      range: "nonNegative",
    },
    {
      name: "peakCurrentA",
      label: "Peak-point current",
      unit: "A",
      optional: true,
      default: PUT_DEFAULTS.peakCurrentA,
      range: "positive",
    },
    {
      name: "valleyCurrentA",
      label: "Valley current",
      unit: "A",
      optional: true,
      default: PUT_DEFAULTS.valleyCurrentA,
      range: "positive",
    },
    {
      name: "dischargeR",
      label: "Cathode (discharge) resistor",
      unit: "Ω",
      optional: true,
      default: PUT_DEFAULTS.dischargeR,
      range: "positive",
    },
  ],
  evaluate,
  segments: (s, r) => ({ unit: "V", segments: relaxationSegments(putInput(s), r) }),
};
