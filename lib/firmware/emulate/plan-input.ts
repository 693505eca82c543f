// What the build hands an emulator for one target: the plan the images were
// built from, the target folder's files, and the acceptance half-widths.
// Tolerance (firmware.md "Timing of an image"): half a timer count either side
// plus the plan's own jitter (the interrupt latency bound for interrupt plans,
// one clock for a fractional RP2040 divider); an interrupt plan's high time may
// add the handler's set/clear path difference (256 clocks at most,
// firmware.md). Each wrapper adds its emulator's own time step.
import type { BundleFile } from "@/lib/bundle/types";
import type { TimerPlan } from "@/lib/engine";
import type { EmulationInput } from "./types";

const ISR_PATH_CYCLES = 256;

export function planKind(plan: Pick<TimerPlan, "start">): string {
  if (plan.start === "trigger") return "triggered";
  if (plan.start === "zero-cross") return "zero-cross";
  return "periodic";
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
  return {
    device: plan.device,
    folder,
    files: files.filter((f) => f.path.startsWith(`${folder}/`)),
    planned: {
      periodS: plan.periodS,
      // The pin's high time: an active-low output is high for the rest of the period.
      highS: plan.activeLow ? plan.periodS - plan.highS : plan.highS,
      pin: plan.pin.port,
    },
    kind: planKind(plan),
    toleranceS: { period, high: period + (isr ? ISR_PATH_CYCLES * cycle : 0) },
    clockHz: plan.clockHz,
    ...(timeoutMs ? { timeoutMs } : {}),
  };
}
