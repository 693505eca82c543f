// Measured stage: period and high time taken from the old board (scope,
// counter or an uploaded capture). Timing terms as in IEEE 181 (pulse
// duration, period); nothing is modelled.
import type { MeasuredStage } from "../stage-types";
import { errorCheck, fmt, invalidStage, running, stopped, type StageModel } from "./model";

export const measuredModel: StageModel<MeasuredStage> = {
  kind: "measured",
  label: "Measured on the old board",
  outputSignal: "measured-output",
  outputLabel: "The measured output: high for the measured high time",
  fields: [
    { name: "periodS", label: "Period", unit: "s", optional: false, range: "positive" },
    { name: "highS", label: "High time", unit: "s", optional: false, range: "positive" },
  ],
  crossCheck(s) {
    if (s.highS >= s.periodS) {
      throw invalidStage(
        "highS",
        `highS (${fmt(s.highS, "s")}) must be shorter than periodS (${fmt(s.periodS, "s")}).`,
      );
    }
  },
  // A tolerance sample can push the high time past the period: no valid timing.
  evaluate: (s) =>
    s.highS < s.periodS
      ? running(s.highS, s.periodS - s.highS)
      : stopped([
          errorCheck("high-exceeds-period", "The high time is not shorter than the period.", "highS"),
        ]),
  segments: () => null,
};
