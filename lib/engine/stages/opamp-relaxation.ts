// Op-amp / comparator relaxation oscillator (astable multivibrator): output
// saturates at ±Vsat, R and C on the inverting input, positive feedback
// fraction beta = R2/(R1 + R2) (R1 output -> non-inverting input, R2 that input
// -> ground). T = 2 R C ln((1 + beta)/(1 - beta)), duty 50 %.
// Source: Sedra & Smith, Microelectronic Circuits, astable multivibrator
// section (from memory); symmetric saturation assumed.
import type { OpampRelaxationStage } from "../stage-types";
import { running, type StageModel } from "./model";

export const feedbackBeta = (s: OpampRelaxationStage) => s.feedbackR2 / (s.feedbackR1 + s.feedbackR2);

export const opampRelaxationModel: StageModel<OpampRelaxationStage> = {
  kind: "opamp-relaxation",
  label: "Op-amp / comparator relaxation oscillator",
  outputSignal: "square-bipolar",
  outputLabel: "Square wave between the saturation levels, 50 % duty",
  fields: [
    { name: "r", label: "Timing resistor", unit: "Ω", optional: false, range: "positive" },
    { name: "c", label: "Timing capacitor", unit: "F", optional: false, range: "positive" },
    {
      name: "feedbackR1",
      label: "Feedback R1 (output to + input)",
      unit: "Ω",
      optional: false,
      range: "positive",
    },
    {
      name: "feedbackR2",
      label: "Feedback R2 (+ input to ground)",
      unit: "Ω",
      optional: false,
      range: "positive",
    },
  ],
  evaluate(s) {
    const b = feedbackBeta(s);
    const half = s.r * s.c * Math.log((1 + b) / (1 - b));
    return running(half, half);
  },
  // Voltages relative to Vsat: the capacitor swings between -beta and +beta.
  segments(s, r) {
    const b = feedbackBeta(s);
    const tau = s.r * s.c;
    return {
      unit: "relative",
      segments: [
        { from: -b, toward: 1, tauS: tau, durationS: r.highS, out: 1 },
        { from: b, toward: -1, tauS: tau, durationS: r.lowS, out: 0 },
      ],
    };
  },
};
