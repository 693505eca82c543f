// 555 monostable (one-shot): after a trigger, C charges through R from 0 V to
// 2/3 Vcc; the output is high for t = ln 3 * R * C ~= 1.1 R C.
// Source: Texas Instruments NE555 datasheet (SLFS022), monostable operation.
import type { Timer555MonostableStage } from "../stage-types";
import { running, warningCheck, type StageModel } from "./model";

export const timer555MonostableModel: StageModel<Timer555MonostableStage> = {
  kind: "timer555-monostable",
  label: "555 monostable (one-shot)",
  outputSignal: "one-shot",
  outputLabel: "One high pulse per trigger on pin 2",
  fields: [
    { name: "r", label: "Timing resistor", unit: "Ω", optional: false, range: "positive" },
    { name: "c", label: "Timing capacitor", unit: "F", optional: false, range: "positive" },
  ],
  // periodS = highS, lowS = 0: one pulse, the repetition is set by the trigger.
  evaluate: (s) => running(Math.log(3) * s.r * s.c, 0),
  warnings: () => [
    warningCheck(
      "needs-trigger",
      "A one-shot: it makes one pulse per falling edge on the trigger input. The replacement needs the same trigger (an input pin or interrupt), not a free-running timer.",
    ),
  ],
  segments: (s, r) => ({
    unit: "relative",
    segments: [
      { from: 0, toward: 1, tauS: s.r * s.c, durationS: r.highS, out: 1 },
      // Idle after the pulse until the next trigger (the sketch shows one pulse, no repeat).
      { from: 0, toward: 0, tauS: 0, durationS: r.highS, out: 0 },
    ],
  }),
};
