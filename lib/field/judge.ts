// Pass/fail of a field check. The limits come from the same checklistLimits()
// call the bundle generator uses for CHECKLIST.md, so the server judges a
// measurement exactly as the printed checklist does.
import { checklistLimits, withinLimit, type BundlePlan } from "@/lib/bundle";
import type { CheckLine } from "./shapes";

type Analysis = Parameters<typeof checklistLimits>[1];

function isPlan(x: unknown): x is BundlePlan {
  const p = x as Partial<BundlePlan> | null;
  return (
    !!p &&
    typeof p === "object" &&
    typeof p.periodS === "number" &&
    typeof p.highS === "number" &&
    typeof p.divider === "number" &&
    typeof p.clockHz === "number"
  );
}

function planOf(entry: unknown): BundlePlan | null {
  if (isPlan(entry)) return entry;
  const nested = (entry as { plan?: unknown } | null)?.plan;
  return isPlan(nested) ? nested : null;
}

/** The plans stored on a revision, one per target, in target order. Accepts a
 *  plain array of plans or entries that carry the plan under `plan`. */
export function revisionPlans(stored: unknown): BundlePlan[] {
  const list = Array.isArray(stored)
    ? stored
    : Array.isArray((stored as { targets?: unknown } | null)?.targets)
      ? (stored as { targets: unknown[] }).targets
      : [];
  return list.map(planOf).filter((p): p is BundlePlan => p !== null);
}

export type Measured = { periodS: number; highS: number; resolutionS?: number };

/** The required tolerance stored with a target (its budget), as a fraction. */
export function requiredRelativeOf(stored: unknown, target: number): number | undefined {
  const list = Array.isArray(stored) ? stored : [];
  const ppm = (list[target] as { budget?: { requiredPpm?: unknown } } | undefined)?.budget?.requiredPpm;
  return typeof ppm === "number" && ppm > 0 ? ppm * 1e-6 : undefined;
}

/** Each checklist line of one target with the measured value and its verdict.
 *  Frequency and duty follow from the two measured times (IEEE Std 181-2011:
 *  duty = pulse duration / period). */
export function judgeCheck(
  plan: BundlePlan,
  analysis: unknown,
  measured: Measured,
  target: number,
  requiredRelative?: number,
): { lines: CheckLine[]; passed: boolean } {
  const values: Record<string, number> = {
    period: measured.periodS,
    high: measured.highS,
    frequency: 1 / measured.periodS,
    duty: measured.highS / measured.periodS,
  };
  const limits = checklistLimits(plan, (analysis ?? null) as Analysis, {
    requiredRelative,
    resolutionS: measured.resolutionS,
  });
  const lines = limits.map((limit) => {
    const value = values[limit.id];
    return { ...limit, target, device: plan.device, measured: value, pass: withinLimit(limit, value) };
  });
  // Only the measured quantities decide; derived lines are shown for reading.
  return { lines, passed: lines.every((l) => l.derived || l.pass) };
}
