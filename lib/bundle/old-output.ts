// What the old stage's output drove, and what the new pin needs in between,
// for the pin map's electrical notes.
import type { BundleRetrofit, StageAnalysis } from "./types";

export function oldOutputNote(retrofit: BundleRetrofit, analysis: StageAnalysis | null): string {
  const what = analysis?.outputLabel
    ? `the old stage's output (${analysis.outputLabel})`
    : "the old stage's output";
  if (retrofit.drivesThyristor) {
    return `Replaces ${what}, which fired a thyristor gate: drive the gate through a gate driver with a pulse transformer or an opto-isolated driver, never from the pin directly.`;
  }
  switch (analysis?.outputSignal) {
    case "pulse-base1":
    case "pulse-cathode":
    case "pulse-discharge":
      return `Replaces ${what} (a short pulse): check the load it fed; a transistor or gate driver stage is needed above the pin's drive rating.`;
    case "square-bipolar":
      return `Replaces ${what}, which swung between the op-amp's ± saturation: the pin gives 0 V / supply only; add a level shifter if the load needs negative swing.`;
    default:
      return `Replaces ${what}: check the load's input level against the pin's logic level; buffer loads above the pin's drive rating.`;
  }
}
