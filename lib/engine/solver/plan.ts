// planTarget: choose the timer, mode and settings, then describe the result.
import { EngineError } from "../errors";
import type { DeviceSpec, TimerConfig, TimerSpec } from "../devices";
import type { TimerMode, TimerPlan } from "../plan-types";
import type { PlanRequest } from "../plan-types";
import { bestHardware, betterHardware, type HardwareChoice } from "./hardware";
import { nearestHighCounts } from "./high-time";
import { bestIsr, betterIsr, type IsrChoice } from "./isr";
import { checkRequest, type CheckedRequest } from "./validate";
import { describePlan } from "./describe";
import { planTriggered } from "./triggered";

/** Interrupt handlers get at least this many CPU cycles (common practice, no source). */
export const MIN_ISR_CPU_CYCLES = 500;
// Totals above 2^50 quanta would lose integer exactness in double arithmetic.
const MAX_TOTAL_QUANTA = 2 ** 50;

export function minIsrIntervalCycles(device: DeviceSpec): number {
  return MIN_ISR_CPU_CYCLES * device.clocksPerCpuCycle;
}

function hardwareChoice(r: CheckedRequest, mode: "pwm" | "toggle") {
  let best: { timer: TimerSpec; choice: HardwareChoice } | null = null;
  for (const timer of r.timers) {
    const target = r.periodS * r.clockHz * timer.dividerQuantum;
    const c = bestHardware(timer, mode, target);
    if (!c || !c.inRange) continue;
    if (!best || betterHardware(c, best.choice)) best = { timer, choice: c };
  }
  return best;
}

function isrChoice(r: CheckedRequest) {
  let best: { timer: TimerSpec; choice: IsrChoice } | null = null;
  const minInterval = minIsrIntervalCycles(r.device);
  for (const timer of r.timers) {
    const c = bestIsr(timer, r.periodS * r.clockHz, r.highS * r.clockHz, minInterval);
    if (c && (!best || betterIsr(c, best.choice))) best = { timer, choice: c };
  }
  return best;
}

function reach(r: CheckedRequest): string {
  const parts: string[] = [];
  for (const mode of ["pwm", "toggle"] as const) {
    let lo = Infinity;
    let hi = 0;
    for (const t of r.timers) {
      const range = t.counts[mode];
      const m = t.modeFactors[mode];
      if (!range || !m) continue;
      lo = Math.min(lo, (t.dividers[0] * Math.min(...m) * range.min) / r.clockHz);
      hi = Math.max(hi, (t.dividers[t.dividers.length - 1] * Math.max(...m) * range.max) / r.clockHz);
    }
    if (hi > 0) parts.push(`${mode} ${fmt(lo)} s to ${fmt(hi)} s`);
  }
  parts.push(`isr from ${fmt((2 * minIsrIntervalCycles(r.device)) / r.clockHz)} s`);
  return parts.join("; ");
}

function fmt(x: number): string {
  return Number(x.toPrecision(4)).toString();
}

export function planTarget(request: PlanRequest): TimerPlan {
  const r = checkRequest(request);
  if (r.trigger.start !== "free") return planTriggered(r);
  if (r.periodS * r.clockHz * 16 > MAX_TOTAL_QUANTA)
    throw new EngineError(
      "unreachable-period",
      `Period ${r.periodS} s is ${fmt(r.periodS * r.clockHz)} clock cycles, beyond what the solver counts exactly (2^46). Use a slower clock.`,
      "periodS",
    );
  const notes: string[] = [];
  if (r.mode !== "isr") {
    const hw = hardwareChoice(r, r.mode);
    if (hw) return finishHardware(r, r.mode, hw.timer, hw.choice, notes);
    const scope = r.timerGiven ? r.timers[0].name : r.device.name;
    const supported = r.timers.some((t) => t.counts[r.mode] && t.modeFactors[r.mode as "pwm" | "toggle"]);
    notes.push(
      supported
        ? `${r.mode} on ${scope} cannot make ${fmt(r.periodS)} s at ${fmt(r.clockHz)} Hz: interrupt plan with a software divider instead.`
        : `${scope} has no ${r.mode} mode: interrupt plan with a software divider instead.`,
    );
  }
  const isr = isrChoice(r);
  if (!isr)
    throw new EngineError(
      "unreachable-period",
      `${r.device.name} at ${fmt(r.clockHz)} Hz cannot make a period of ${fmt(r.periodS)} s with a high time of ${fmt(r.highS)} s. Reach: ${reach(r)}.`,
      "periodS",
    );
  return finishIsr(r, isr.timer, isr.choice, notes);
}

function finishHardware(
  r: CheckedRequest,
  mode: "pwm" | "toggle",
  timer: TimerSpec,
  c: HardwareChoice,
  notes: string[],
): TimerPlan {
  const m = c.modeFactor;
  const highCounts =
    mode === "toggle"
      ? c.periodCounts
      : nearestHighCounts((r.highS * r.clockHz) / (c.divider * m), c.periodCounts, timer.highStep);
  const config: TimerConfig = {
    mode,
    divider: c.divider,
    periodCounts: c.periodCounts,
    modeFactor: m,
    softwareDivider: 1,
    highCounts,
  };
  return describePlan(r, timer, config, notes);
}

function finishIsr(r: CheckedRequest, timer: TimerSpec, c: IsrChoice, notes: string[]): TimerPlan {
  const config: TimerConfig = {
    mode: "isr" as TimerMode,
    divider: c.divider,
    periodCounts: c.periodCounts,
    modeFactor: 1,
    softwareDivider: c.softwareDivider,
    highCounts: c.highCounts,
  };
  return describePlan(r, timer, config, notes);
}
