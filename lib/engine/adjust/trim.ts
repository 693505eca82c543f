// The target side of a trimmer: it is set once at commissioning, so the new
// board holds its effect as one calibration constant, the period in timer
// counts of the target's own plan. The constant may take the counts of the
// old stage's period with the trimmer at either end; the high time follows
// the stage's law through three points (either end and the stored value), so
// the stored value's build reproduces the plan exactly.
import { EngineError } from "../errors";
import { analyzeStage, validateStage } from "../analyze-stage";
import type { Stage } from "../stage-types";
import { stageAt, validateControl } from "./travel";

/** One point of the constant's range: period counts and the high counts that go with them. */
export interface TrimPoint {
  periodCounts: number;
  highCounts: number;
}

export interface TrimRange {
  field: string;
  /** one timer count of the plan, seconds: the period per unit of the constant */
  countS: number;
  highPerCount: number;
  /** the constant's range (trimmer ends, in counts; min <= stored <= max); highCounts in 1/highPerCount counts */
  min: TrimPoint;
  stored: TrimPoint;
  max: TrimPoint;
  /** the old stage's period with the stored value */
  periodStoredS: number;
  /** the old stage's period at the trimmer's ends */
  periodAtMinS: number;
  periodAtMaxS: number;
}

function bad(field: string, message: string): never {
  throw new EngineError("invalid-request", message, field);
}

/**
 * High counts for a constant `n` (what the firmware's preprocessor computes):
 * linear between the stored point and the end on n's side, rounded half up.
 */
export function trimHighCounts(range: TrimRange, n: number): number {
  const { min, stored, max } = range;
  if (n === stored.periodCounts) return stored.highCounts;
  const [a, b] = n < stored.periodCounts ? [min, stored] : [stored, max];
  const span = b.periodCounts - a.periodCounts;
  return Math.floor(
    (a.highCounts * (b.periodCounts - n) + b.highCounts * (n - a.periodCounts) + Math.floor(span / 2)) / span,
  );
}

/**
 * The calibration constant's range on the target `plan` (planned for the
 * stored stage, hardware PWM, software divider 1). Whether the longest end
 * fits the timer's registers is the caller's check (the bundle's device view).
 */
/** The plan fields the range needs (a TimerPlan or the bundle's copy of one). */
export interface TrimPlan {
  device: string;
  timer: string;
  mode: string;
  clockHz: number;
  divider: number;
  modeFactor: number;
  softwareDivider: number;
  periodCounts: number;
  highCounts: number;
}

export function buildTrimRange(
  stageInput: Stage,
  controlInput: unknown,
  plan: TrimPlan,
  /** high-time steps per count (4 for the PIC12F1840's quarter-count duty, else 1); highCounts are in these steps */
  highPerCount = 1,
): TrimRange {
  const stage = validateStage(stageInput);
  const control = validateControl(stage, controlInput);
  if (control.kind !== "trimmer")
    bad("control.kind", 'A calibration constant stands for a trimmer: control.kind must be "trimmer".');
  if (plan.mode !== "pwm" || plan.softwareDivider !== 1)
    bad(
      "mode",
      "A trimmer's calibration constant sets a hardware PWM period: plan the target with mode pwm.",
    );
  const countS = (plan.divider * plan.modeFactor) / plan.clockHz;
  const ends = [0, 1].map((x) => {
    const a = analyzeStage(stageAt(stage, control, x), { samples: 1 });
    if (!a.oscillates)
      bad(
        "control",
        `With the trimmer at its ${x === 0 ? "start" : "end"} the stage does not run; keep the whole travel inside its limits.`,
      );
    return a;
  });
  const point = (periodS: number, highS: number): TrimPoint => {
    const periodCounts = Math.round(periodS / countS);
    const high = Math.round((highS / countS) * highPerCount);
    return { periodCounts, highCounts: Math.min((periodCounts - 1) * highPerCount, Math.max(1, high)) };
  };
  const [p0, p1] = ends.map((a) => point(a.periodS, a.highS));
  const [lo, hi, loS, hiS] =
    p0.periodCounts <= p1.periodCounts
      ? [p0, p1, ends[0].periodS, ends[1].periodS]
      : [p1, p0, ends[1].periodS, ends[0].periodS];
  const stored = { periodCounts: plan.periodCounts, highCounts: Math.round(plan.highCounts * highPerCount) };
  const value = (stage as unknown as Record<string, number>)[control.field];
  if (
    !(value >= control.seriesR && value <= control.seriesR + control.trackR) ||
    stored.periodCounts < lo.periodCounts ||
    stored.periodCounts > hi.periodCounts
  )
    bad(
      `stage.${control.field}`,
      `The stored value stage.${control.field} = ${value} lies outside the trimmer's range (control.seriesR to control.seriesR + control.trackR).`,
    );
  if (lo.periodCounts < 2) bad("control", "The trimmer's shortest period is under two timer counts.");
  return {
    field: control.field,
    countS,
    highPerCount,
    min: lo,
    stored,
    max: hi,
    periodStoredS: analyzeStage(stage, { samples: 1 }).periodS,
    periodAtMinS: loS,
    periodAtMaxS: hiS,
  };
}
