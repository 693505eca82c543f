// Pass limits of the checklist. The field-check code calls the same function,
// so the server judges a measurement exactly as the printed checklist does.
//
// Limit = achieved value ± (clock accuracy × value + jitter + one timer count).
// One timer count is the output's quantisation step (a frequency counter or
// scope sees edges only on timer counts); jitter is what the plan reports
// (interrupt latency, fractional-divider dither).
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
  clockAccuracyPpm?: number,
): ChecklistLimit[] {
  const b = limitBasis(plan, clockAccuracyPpm);
  const band = (value: number) => value * b.clockAccuracyPpm * 1e-6 + b.jitterS + b.countS;
  const pMin = plan.periodS - band(plan.periodS);
  const pMax = plan.periodS + band(plan.periodS);
  const hMin = Math.max(0, plan.highS - band(plan.highS));
  const hMax = Math.min(pMax, plan.highS + band(plan.highS));
  return [
    { id: "period", label: "Period", unit: "s", expected: plan.periodS, min: pMin, max: pMax },
    { id: "high", label: "High time", unit: "s", expected: plan.highS, min: hMin, max: hMax },
    {
      id: "frequency",
      label: "Frequency",
      unit: "Hz",
      expected: 1 / plan.periodS,
      min: 1 / pMax,
      max: 1 / pMin,
    },
    {
      id: "duty",
      label: "Duty cycle",
      unit: "",
      expected: plan.highS / plan.periodS,
      min: hMin / pMax,
      max: hMax / pMin,
    },
  ];
}

/** True when a measured value lies inside a limit (inclusive). */
export function withinLimit(limit: ChecklistLimit, measured: number): boolean {
  return Number.isFinite(measured) && measured >= limit.min && measured <= limit.max;
}
