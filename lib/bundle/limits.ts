// Pass limits of the checklist. The field-check code calls the same function,
// so the server judges a measurement exactly as the printed checklist does.
//
// Limit = achieved value ± (clock accuracy × value + jitter + one timer count).
// One timer count is the output's quantisation step (a frequency counter or
// scope sees edges only on timer counts); jitter is what the plan reports
// (interrupt latency, fractional-divider dither).
import { eng } from "./format";
import type { BundlePlan, StageAnalysis } from "./types";

/** Crystal ±50 ppm when the plan does not state its clock accuracy (common practice, no source). */
export const DEFAULT_CLOCK_ACCURACY_PPM = 50;

export type LimitId = "period" | "high" | "frequency" | "duty";

export interface ChecklistLimit {
  id: LimitId;
  label: string;
  unit: "s" | "Hz" | "";
  expected: number;
  min: number;
  max: number;
  /** Frequency and duty follow from the two measured times: shown, not judged
   *  on their own, so one slip fails one line, not three. */
  derived: boolean;
  /** Where the limit comes from, in words for the checklist line. */
  source: string;
}

export interface LimitOptions {
  /** The engineer's required tolerance as a fraction (2 % = 0.02). */
  requiredRelative?: number;
  /** Reading resolution of the instrument in seconds (scope cursors, counter digit). */
  resolutionS?: number;
  clockAccuracyPpm?: number;
}

export interface ChecklistBasis {
  clockAccuracyPpm: number;
  jitterS: number;
  countS: number;
}

export function limitBasis(plan: BundlePlan, clockAccuracyPpm?: number): ChecklistBasis {
  return {
    clockAccuracyPpm: clockAccuracyPpm ?? plan.clockAccuracyPpm ?? DEFAULT_CLOCK_ACCURACY_PPM,
    jitterS: plan.jitterS ?? 0,
    countS: plan.divider / plan.clockHz,
  };
}

export function checklistLimits(
  plan: BundlePlan,
  // The old stage's analysis is reference only: the new board must match the
  // plan, which already carries the choice of what to reproduce.
  _analysis?: StageAnalysis | null,
  o: LimitOptions = {},
): ChecklistLimit[] {
  const b = limitBasis(plan, o.clockAccuracyPpm);
  const required = o.requiredRelative !== undefined && o.requiredRelative > 0 ? o.requiredRelative : 0;
  const resolution = o.resolutionS !== undefined && o.resolutionS > 0 ? o.resolutionS : 0;
  const boardBand = (value: number) => value * b.clockAccuracyPpm * 1e-6 + b.jitterS + b.countS;
  // The promise to the process is the required tolerance; the board's own
  // spread is the floor (a limit tighter than the board can hold would fail
  // good boards). The reading's resolution widens the band: a cursor reading
  // cannot be judged finer than it was read.
  const band = (value: number) => Math.max(required * value, boardBand(value)) + resolution;
  // Each line names where its limit comes from: the engineer's required
  // tolerance, the plan (the board's own spread) and the stated instrument.
  const why = (value: number) => {
    const parts = [
      required * value >= boardBand(value)
        ? `required tolerance ±${trimPct(required)} %`
        : `plan: clock ±${trimNum(b.clockAccuracyPpm)} ppm + jitter + one timer count`,
    ];
    if (resolution > 0) parts.push(`instrument resolution ${eng(resolution, "s", 3)}`);
    return parts.join(" + ");
  };
  const pMin = plan.periodS - band(plan.periodS);
  const pMax = plan.periodS + band(plan.periodS);
  const hMin = Math.max(0, plan.highS - band(plan.highS));
  const hMax = Math.min(pMax, plan.highS + band(plan.highS));
  const fromTimes = "derived from the measured period and high time (information, not judged on its own)";
  return [
    {
      id: "period",
      label: "Period",
      unit: "s",
      expected: plan.periodS,
      min: pMin,
      max: pMax,
      derived: false,
      source: why(plan.periodS),
    },
    {
      id: "high",
      label: "High time",
      unit: "s",
      expected: plan.highS,
      min: hMin,
      max: hMax,
      derived: false,
      source: why(plan.highS),
    },
    {
      id: "frequency",
      label: "Frequency",
      unit: "Hz",
      expected: 1 / plan.periodS,
      min: 1 / pMax,
      max: 1 / pMin,
      derived: true,
      source: fromTimes,
    },
    {
      id: "duty",
      label: "Duty cycle",
      unit: "",
      expected: plan.highS / plan.periodS,
      min: hMin / pMax,
      max: hMax / pMin,
      derived: true,
      source: fromTimes,
    },
  ];
}

function trimPct(fraction: number): string {
  return String(Number((fraction * 100).toPrecision(6)));
}

function trimNum(x: number): string {
  return String(Number(x.toPrecision(6)));
}

/** True when a measured value lies inside a limit (inclusive). */
export function withinLimit(limit: ChecklistLimit, measured: number): boolean {
  return Number.isFinite(measured) && measured >= limit.min && measured <= limit.max;
}
