// Plans for every target of a stage, with the accuracy budget. Pure engine
// code: the retrofit page runs it live in the browser and generation runs it
// on the server, so both show the same numbers.
import {
  accuracyBudget,
  isEngineError,
  planTarget,
  type AccuracyBudget,
  type PlanRequest,
  type StageAnalysis,
  type TimerPlan,
} from "@/lib/engine";
import type { TargetSnapshot } from "./types";

export type TargetPlanRow =
  | { ok: true; index: number; plan: TimerPlan; budget: AccuracyBudget | null }
  | { ok: false; index: number; message: string; field?: string };

/** Half the corner-to-corner width of the old stage's period, relative to nominal. */
export function stageSpreadRelative(analysis: StageAnalysis): number | undefined {
  const c = analysis.spread?.corners.periodS;
  if (!c || !(analysis.periodS > 0)) return undefined;
  return (c.max - c.min) / 2 / analysis.periodS;
}

export function planRequestOf(analysis: StageAnalysis, t: TargetSnapshot): PlanRequest {
  const req: PlanRequest = {
    device: t.device,
    clockHz: t.clockHz,
    periodS: analysis.periodS,
    highS: analysis.highS,
    clockSource: t.clockSource,
  };
  if (t.mode) req.mode = t.mode;
  if (t.timer) req.timer = t.timer.toUpperCase();
  if (t.clockAccuracyPpm !== null) req.clockAccuracyPpm = t.clockAccuracyPpm;
  if (t.activeLow) req.activeLow = true;
  return req;
}

export function planOne(analysis: StageAnalysis, t: TargetSnapshot, index: number): TargetPlanRow {
  try {
    const plan = planTarget(planRequestOf(analysis, t));
    const spread = stageSpreadRelative(analysis);
    const budget =
      t.requiredTolerancePct !== null
        ? accuracyBudget(plan, {
            toleranceRelative: t.requiredTolerancePct / 100,
            ...(spread !== undefined ? { stageSpreadRelative: spread } : {}),
          })
        : null;
    return { ok: true, index, plan, budget };
  } catch (e) {
    if (!isEngineError(e)) throw e;
    return { ok: false, index, message: e.message, field: e.field };
  }
}

export function planTargets(analysis: StageAnalysis, targets: TargetSnapshot[]): TargetPlanRow[] {
  if (!analysis.oscillates) {
    return targets.map((_, index) => ({
      ok: false,
      index,
      message: "The old stage does not oscillate; fix the stage first.",
    }));
  }
  return targets.map((t, i) => planOne(analysis, t, i));
}

/** Validated form/API target -> snapshot with nulls for what was left out. */
export function snapshotOf(t: {
  device: string;
  clockSource: string;
  clockHz: number;
  clockAccuracyPpm?: number | null;
  mode?: string | null;
  timer?: string | null;
  requiredTolerancePct?: number | null;
  activeLow?: boolean | null;
}): TargetSnapshot {
  return {
    device: t.device,
    clockSource: t.clockSource,
    clockHz: t.clockHz,
    clockAccuracyPpm: t.clockAccuracyPpm ?? null,
    mode: t.mode === "pwm" || t.mode === "toggle" || t.mode === "isr" ? t.mode : null,
    timer: t.timer ? t.timer : null,
    requiredTolerancePct: t.requiredTolerancePct ?? null,
    activeLow: t.activeLow === true,
  };
}
