// What every wrapper checks before it runs anything: the deployment may switch
// emulation off, and a period too long for the budget is not run. Plain
// reasons, never a guessed result.
import { formatEng } from "@/lib/engine/units";
import { emulatorsOff as emulatorsSwitchedOff } from "./harness/tool";
import type { EmulationResult } from "./types";

/**
 * Emulated time one run may cover by default (keeps CI and workers quick). A
 * wrapper whose emulator is fast may pass a larger budget; the wall-clock cap
 * (DEFAULT_TIMEOUT_MS) holds for every run.
 */
export const MAX_EMULATED_S = 2;
/** Default wall-clock cap of one emulator run. */
export const DEFAULT_TIMEOUT_MS = 30_000;

export function notEmulated(reason: string, tool?: string): EmulationResult {
  return { verdict: "not-emulated", reason, ...(tool ? { tool } : {}) };
}

/** Set CLOCKGRAFT_EMULATORS_OFF=1 to run no emulator (every target answers not-emulated). */
export function emulatorsOff(): EmulationResult | null {
  return emulatorsSwitchedOff()
    ? notEmulated("Emulators are switched off on this deployment (CLOCKGRAFT_EMULATORS_OFF=1).")
    : null;
}

/** The run needed to see `periods` full periods after start-up, or a refusal when it exceeds the budget. */
export function runLengthS(
  periodS: number,
  periods: number,
  startUpS = 0,
  budgetS = MAX_EMULATED_S,
): number | EmulationResult {
  const needed = startUpS + (periods + 2.5) * periodS;
  if (needed > budgetS)
    return notEmulated(
      `A period of ${formatEng(periodS, "s")} needs ${formatEng(needed, "s")} of emulated time; the emulator budget is ${formatEng(budgetS, "s")} per target.`,
    );
  return needed;
}
