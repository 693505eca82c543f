// What the build hands an emulator for one target: the plan the images were
// built from, the target folder's files, and the acceptance half-widths.
// Tolerance (firmware.md "Timing of an image"): half a timer count either side
// plus the plan's own jitter (the interrupt latency bound for interrupt plans,
// one clock for a fractional RP2040 divider); an interrupt plan's high time may
// add the handler's set/clear path difference (256 clocks at most,
// firmware.md). Each wrapper adds its emulator's own time step.
// Triggered and zero-cross plans also carry the input to drive, the counted
// delay and pulse, one count and the stated latency (judge-trigger.ts).
import type { BundleFile } from "@/lib/bundle/types";
import type { TimerPlan } from "@/lib/engine";
import type { EmulationInput, TriggerDrive } from "./types";

const ISR_PATH_CYCLES = 256;

export function planKind(plan: Pick<TimerPlan, "start">): string {
  if (plan.start === "trigger") return "triggered";
  if (plan.start === "zero-cross") return "zero-cross";
  return "periodic";
}

/** The input drive of a triggered or zero-cross plan, or undefined for a free-running one. */
export function triggerDriveOf(plan: TimerPlan): TriggerDrive | undefined {
  if (planKind(plan) === "periodic" || !plan.input) return undefined;
  return {
    input: plan.input.port,
    edge: plan.edge ?? (plan.start === "zero-cross" ? "both" : "falling"),
    delayS: plan.delayS ?? 0,
    widthS: plan.highS,
    latencyS: plan.latencyS ?? 0,
    countS: plan.divider / plan.clockHz,
    activeLow: plan.activeLow,
  };
}

export function emulationInputOf(
  plan: TimerPlan,
  folder: string,
  files: BundleFile[],
  timeoutMs?: number,
): EmulationInput {
  const isr = plan.mode === "isr";
  const cycle = 1 / plan.clockHz;
  const countS = plan.divider * cycle;
  const period = 0.5 * countS + plan.jitterS;
  const trigger = triggerDriveOf(plan);
  return {
    device: plan.device,
    folder,
    files: files.filter((f) => f.path.startsWith(`${folder}/`)),
    planned: {
      periodS: plan.periodS,
      // The pin's high time: an active-low output is high for the rest of the period.
      // A triggered plan's highS is the pulse (its period is the shortest time between input edges).
      highS: plan.activeLow && !trigger ? plan.periodS - plan.highS : plan.highS,
      pin: plan.pin.port,
    },
    kind: planKind(plan),
    toleranceS: { period, high: period + (isr ? ISR_PATH_CYCLES * cycle : 0) },
    clockHz: plan.clockHz,
    ...(timeoutMs ? { timeoutMs } : {}),
    ...(trigger ? { trigger } : {}),
  };
}
