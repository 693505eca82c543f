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
import { buildRefusal } from "@/lib/bundle/buildable";
import type { GateDrive, TargetSnapshot, TargetTrigger } from "./types";
import { plainMessage } from "@/lib/validation/plain-message";

export type TargetPlanRow =
  | { ok: true; index: number; plan: TimerPlan; budget: AccuracyBudget | null }
  | { ok: false; index: number; message: string; field?: string };

/** Half the corner-to-corner width of the old stage's period, relative to nominal. */
export function stageSpreadRelative(analysis: StageAnalysis): number | undefined {
  const c = analysis.spread?.corners.periodS;
  if (!c || !(analysis.periodS > 0)) return undefined;
  return (c.max - c.min) / 2 / analysis.periodS;
}

/**
 * How the target starts: as set, else by the stage (engine.md section 6): a
 * mains-synchronised stage follows the zero crossings, a 555 one-shot its
 * trigger; everything else runs free.
 */
export function startOf(analysis: StageAnalysis, t: TargetSnapshot): "free" | "trigger" | "zero-cross" {
  if (t.trigger?.start) return t.trigger.start;
  if (analysis.sync) return "zero-cross";
  if (analysis.kind === "timer555-monostable") return "trigger";
  return "free";
}

export function planRequestOf(analysis: StageAnalysis, t: TargetSnapshot): PlanRequest {
  const start = startOf(analysis, t);
  const req: PlanRequest = {
    device: t.device,
    clockHz: t.clockHz,
    periodS: analysis.periodS,
    highS: analysis.highS,
    clockSource: t.clockSource,
  };
  if (start !== "free") {
    const tr: TargetTrigger = t.trigger ?? {};
    req.start = start;
    req.highS = tr.pulseS ?? analysis.highS;
    req.delayS = tr.delayS ?? analysis.sync?.firingDelayS ?? 0;
    // Zero-cross: the half cycle. Trigger: the shortest time between triggers, or
    // twice delay plus pulse when not given (closer triggers are ignored).
    req.periodS =
      start === "zero-cross"
        ? (tr.minIntervalS ?? analysis.sync?.halfCycleS ?? NaN)
        : (tr.minIntervalS ?? 2 * (req.delayS + req.highS));
    if (tr.edge) req.edge = tr.edge;
    if (start === "trigger" && tr.retrigger) req.retrigger = tr.retrigger;
  } else if (t.mode) req.mode = t.mode;
  if (t.timer) req.timer = t.timer.toUpperCase();
  if (t.clockAccuracyPpm !== null) req.clockAccuracyPpm = t.clockAccuracyPpm;
  if (t.activeLow) req.activeLow = true;
  return req;
}

export function planOne(analysis: StageAnalysis, t: TargetSnapshot, index: number): TargetPlanRow {
  try {
    const request = planRequestOf(analysis, t);
    if (request.start === "zero-cross" && !Number.isFinite(request.periodS))
      return {
        ok: false,
        index,
        field: "minIntervalS",
        message:
          "A zero-cross start needs the half cycle: synchronise the stage to the mains, or give the shortest time between input edges.",
      };
    const plan = planTarget(request);
    // Generation refuses what no firmware exists for; live plans say so too.
    const refusal = buildRefusal(plan);
    if (refusal) return { ok: false, index, ...refusal };
    const spread = stageSpreadRelative(analysis);
    const gate = t.gateDrive ?? undefined;
    const budget =
      t.requiredTolerancePct !== null
        ? accuracyBudget(plan, {
            toleranceRelative: t.requiredTolerancePct / 100,
            ...(spread !== undefined ? { stageSpreadRelative: spread } : {}),
            ...(gate ? { gateDrive: gate } : {}),
          })
        : gate
          ? // Gate needs alone still give a verdict: judged against an unbounded tolerance.
            accuracyBudget(plan, { toleranceRelative: 1e6, gateDrive: gate })
          : null;
    return { ok: true, index, plan, budget };
  } catch (e) {
    if (!isEngineError(e)) throw e;
    return { ok: false, index, message: plainMessage(e.message), field: e.field };
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
  // stored rows carry jsonb; validated form/API targets the flat fields
  trigger?: unknown;
  gateDrive?: unknown;
  start?: string | null;
  delayS?: number | null;
  pulseS?: number | null;
  minIntervalS?: number | null;
  edge?: string | null;
  retrigger?: string | null;
  gateMinS?: number | null;
  gateMaxS?: number | null;
  gateTrainPeriodS?: number | null;
  gateTrainPulses?: number | null;
}): TargetSnapshot {
  const trigger = (t.trigger as TargetTrigger | null | undefined) ?? triggerOf(t);
  const gateDrive = (t.gateDrive as GateDrive | null | undefined) ?? gateDriveOf(t);
  return {
    device: t.device,
    clockSource: t.clockSource,
    clockHz: t.clockHz,
    clockAccuracyPpm: t.clockAccuracyPpm ?? null,
    mode: t.mode === "pwm" || t.mode === "toggle" || t.mode === "isr" ? t.mode : null,
    timer: t.timer ? t.timer : null,
    requiredTolerancePct: t.requiredTolerancePct ?? null,
    activeLow: t.activeLow === true,
    ...(trigger ? { trigger } : {}),
    ...(gateDrive ? { gateDrive } : {}),
  };
}

type FlatTarget = Parameters<typeof snapshotOf>[0];

function compact<T extends object>(o: T): T | null {
  const out = Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined && v !== null));
  return Object.keys(out).length ? (out as T) : null;
}

/** The flat form/API trigger fields as the stored TargetTrigger (null when none is set). */
export function triggerOf(t: FlatTarget): TargetTrigger | null {
  return compact({
    start: t.start as TargetTrigger["start"],
    delayS: t.delayS ?? undefined,
    pulseS: t.pulseS ?? undefined,
    minIntervalS: t.minIntervalS ?? undefined,
    edge: t.edge as TargetTrigger["edge"],
    retrigger: t.retrigger as TargetTrigger["retrigger"],
  });
}

/** The flat form/API gate fields as the stored GateDrive (null when none is set). */
export function gateDriveOf(t: FlatTarget): GateDrive | null {
  return compact({
    minPulseS: t.gateMinS ?? undefined,
    maxPulseS: t.gateMaxS ?? undefined,
    trainPeriodS: t.gateTrainPeriodS ?? undefined,
    trainPulses: t.gateTrainPulses ?? undefined,
  });
}
