// Accuracy budget of a plan: the clock's tolerance, the plan's quantization
// error and its single-period jitter, added worst case, set beside the
// required period tolerance and the old stage's own spread. Also: which of
// the device's clock options would meet the tolerance with this plan.
import { EngineError } from "./errors";
import { findDevice } from "./devices";
import type { ClockKind, TimerPlan } from "./plan-types";

export type BudgetTerm = "clock" | "quantization" | "jitter";

export interface ClockVerdict {
  id: string;
  label: string;
  kind: ClockKind;
  accuracyPpm: number;
  totalPpm: number;
  ok: boolean;
}

export interface AccuracyBudget {
  requiredPpm: number;
  clockPpm: number;
  quantizationPpm: number;
  jitterPpm: number;
  /** Worst-case sum of the three terms. */
  totalPpm: number;
  dominant: BudgetTerm;
  meetsTolerance: boolean;
  /** Old stage's relative spread in ppm, when given. */
  stageSpreadPpm: number | null;
  /** stageSpreadPpm / totalPpm: how many times tighter the new stage is (null without a spread or with a zero total). */
  improvement: number | null;
  clockOptions: ClockVerdict[];
  /** True when some internal oscillator option of the device meets the tolerance. */
  internalOscillatorOk: boolean;
  notes: string[];
}

export interface BudgetInput {
  /** Required period tolerance, relative (0.01 = 1 %). */
  toleranceRelative: number;
  /** Old stage's period spread, relative half-width (e.g. (max - min) / 2 / nominal). */
  stageSpreadRelative?: number;
}

function nonNegative(v: unknown, field: string): number {
  if (typeof v !== "number" || !Number.isFinite(v) || v < 0)
    throw new EngineError("invalid-request", `${field} must be a finite number >= 0.`, field);
  return v;
}

export function accuracyBudget(plan: TimerPlan, input: BudgetInput): AccuracyBudget {
  const required = nonNegative(input.toleranceRelative, "toleranceRelative") * 1e6;
  const spread =
    input.stageSpreadRelative === undefined
      ? null
      : nonNegative(input.stageSpreadRelative, "stageSpreadRelative") * 1e6;
  const quantizationPpm = Math.abs(plan.periodErrorPpm);
  const jitterPpm = (plan.jitterS / plan.periodS) * 1e6;
  const clockPpm = plan.clockAccuracyPpm;
  const totalPpm = clockPpm + quantizationPpm + jitterPpm;
  const terms: [BudgetTerm, number][] = [
    ["clock", clockPpm],
    ["quantization", quantizationPpm],
    ["jitter", jitterPpm],
  ];
  const dominant = terms.reduce((a, b) => (b[1] > a[1] ? b : a))[0];
  const device = findDevice(plan.device);
  const clockOptions: ClockVerdict[] = (device?.clocks ?? []).map((c) => {
    const total = c.accuracyPpm + quantizationPpm + jitterPpm;
    return {
      id: c.id,
      label: c.label,
      kind: c.kind,
      accuracyPpm: c.accuracyPpm,
      totalPpm: total,
      ok: total <= required,
    };
  });
  const internalOscillatorOk = clockOptions.some((c) => c.kind === "internal" && c.ok);
  const notes: string[] = [];
  const meets = totalPpm <= required;
  notes.push(
    `${meets ? "Meets" : "Misses"} the required ${round(required)} ppm: clock ${round(clockPpm)} + quantization ${round(quantizationPpm)} + jitter ${round(jitterPpm)} = ${round(totalPpm)} ppm; ${dominant} dominates.`,
  );
  if (quantizationPpm > required)
    notes.push(
      "Quantization alone exceeds the tolerance: change the clock frequency (see the crystal suggestion).",
    );
  if (spread !== null)
    notes.push(
      spread >= totalPpm
        ? `The old stage's spread (${round(spread)} ppm) is larger than the new budget.`
        : `The new budget exceeds the old stage's spread (${round(spread)} ppm).`,
    );
  return {
    requiredPpm: required,
    clockPpm,
    quantizationPpm,
    jitterPpm,
    totalPpm,
    dominant,
    meetsTolerance: meets,
    stageSpreadPpm: spread,
    improvement: spread !== null && totalPpm > 0 ? spread / totalPpm : null,
    clockOptions,
    internalOscillatorOk,
    notes,
  };
}

function round(x: number): string {
  return Number(x.toPrecision(3)).toString();
}
