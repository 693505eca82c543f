// Accuracy budget of a plan: the clock's tolerance, the plan's quantization
// error and its single-period jitter, added worst case, set beside the
// required period tolerance and the old stage's own spread. Also: which of
// the device's clock options would meet the tolerance with this plan.
// Triggered plans (engine.md section 6) are judged on the delay from the
// input edge instead of the period. Gate-drive needs (minimum and maximum
// gate pulse, optional pulse train) are part of the verdict: a pulse outside
// them misses whatever the clock does.
import { EngineError } from "./errors";
import { findDevice } from "./devices";
import type { ClockKind, TimerPlan } from "./plan-types";
import { formatPpm } from "./units";

export type BudgetTerm = "clock" | "quantization" | "jitter";

export interface ClockVerdict {
  id: string;
  label: string;
  kind: ClockKind;
  accuracyPpm: number;
  /** Where the option's accuracy figure comes from (datasheet, common practice, from memory). */
  accuracySource: string;
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
  /** Present when gate-drive needs were given. */
  gate?: GateVerdict;
  /** The verdict shown: meets the tolerance and, when given, the gate-drive needs. */
  verdict: "meets" | "misses";
  /** What the tolerance is measured on: the period, or the delay of a triggered plan. */
  basis: "period" | "delay";
}

/** What the thyristor's gate needs (seconds); every field optional. */
export interface GateDrive {
  minPulseS?: number;
  maxPulseS?: number;
  /** Pulse train for inductive loads: this many pulses of the plan's width, one every trainPeriodS. */
  trainPeriodS?: number;
  trainPulses?: number;
}

export interface GateVerdict {
  ok: boolean;
  pulseS: number;
  /** one sentence per need, met or missed */
  findings: string[];
}

export interface BudgetInput {
  /** Required period tolerance, relative (0.01 = 1 %). */
  toleranceRelative: number;
  /** Old stage's period spread, relative half-width (e.g. (max - min) / 2 / nominal). */
  stageSpreadRelative?: number;
  gateDrive?: GateDrive;
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
  // Triggered plans: the period is the mains' or the trigger's; what the
  // board sets is the delay (or, with no delay, the pulse).
  const triggered = plan.start !== undefined && plan.start !== "free";
  const ref = triggered ? (plan.targetDelayS! > 0 ? plan.targetDelayS! : plan.targetHighS) : plan.periodS;
  const quantizationPpm = triggered
    ? plan.targetDelayS! > 0
      ? (Math.abs(plan.delayErrorS!) / ref) * 1e6
      : Math.abs(plan.highErrorPpm)
    : Math.abs(plan.periodErrorPpm);
  const jitterPpm = (plan.jitterS / ref) * 1e6;
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
      accuracySource: c.accuracySource,
      totalPpm: total,
      ok: total <= required,
    };
  });
  const internalOscillatorOk = clockOptions.some((c) => c.kind === "internal" && c.ok);
  const notes: string[] = [];
  const meets = totalPpm <= required;
  notes.push(
    `${meets ? "Meets" : "Misses"} the required ${formatPpm(required)}${triggered ? " on the delay from the input edge" : ""}: clock ${formatPpm(clockPpm)} + quantization ${formatPpm(quantizationPpm)} + jitter ${formatPpm(jitterPpm)} = ${formatPpm(totalPpm)}; ${dominant} dominates.`,
  );
  const used = device?.clocks.find((c) => c.id === plan.clockSource);
  if (used)
    notes.push(
      used.accuracyPpm === clockPpm
        ? `Clock figure ${formatPpm(clockPpm)} (${used.label}): ${used.accuracySource}.`
        : `Clock figure ${formatPpm(clockPpm)} as entered; ${used.label} is listed at ${formatPpm(used.accuracyPpm)} (${used.accuracySource}).`,
    );
  const gate = input.gateDrive ? gateVerdict(plan, input.gateDrive) : undefined;
  if (gate) notes.push(...gate.findings);
  if (quantizationPpm > required)
    notes.push(
      "Quantization alone exceeds the tolerance: change the clock frequency (see the crystal suggestion).",
    );
  if (spread !== null)
    notes.push(
      spread >= totalPpm
        ? `The old stage's spread (${formatPpm(spread)}) is larger than the new budget.`
        : `The new budget exceeds the old stage's spread (${formatPpm(spread)}).`,
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
    ...(gate ? { gate } : {}),
    verdict: meets && gate?.ok !== false ? "meets" : "misses",
    basis: triggered ? "delay" : "period",
  };
}

function optionalPositive(v: unknown, field: string): number | undefined {
  if (v === undefined) return undefined;
  if (typeof v !== "number" || !Number.isFinite(v) || v <= 0)
    throw new EngineError("invalid-request", `${field} must be a finite number above zero.`, field);
  return v;
}

/**
 * The plan's output pulse against the gate's needs. A free-running toggle plan
 * has a 50 % "pulse": half its period, which is what the gate would get.
 */
export function gateVerdict(plan: TimerPlan, need: GateDrive): GateVerdict {
  const min = optionalPositive(need.minPulseS, "gateDrive.minPulseS");
  const max = optionalPositive(need.maxPulseS, "gateDrive.maxPulseS");
  const trainPeriod = optionalPositive(need.trainPeriodS, "gateDrive.trainPeriodS");
  const trainPulses = optionalPositive(need.trainPulses, "gateDrive.trainPulses");
  if (min !== undefined && max !== undefined && min > max)
    throw new EngineError(
      "invalid-request",
      "gateDrive.minPulseS must not be above gateDrive.maxPulseS.",
      "gateDrive.minPulseS",
    );
  if (trainPulses !== undefined && !Number.isInteger(trainPulses))
    throw new EngineError(
      "invalid-request",
      "gateDrive.trainPulses must be a whole number.",
      "gateDrive.trainPulses",
    );
  if ((trainPeriod === undefined) !== (trainPulses === undefined))
    throw new EngineError(
      "invalid-request",
      "A pulse train needs both gateDrive.trainPeriodS and gateDrive.trainPulses.",
      trainPeriod === undefined ? "gateDrive.trainPeriodS" : "gateDrive.trainPulses",
    );
  // The pin's active pulse: with activeLow the pin's high time is the rest of the period.
  const pulseS = plan.activeLow && plan.start === undefined ? plan.periodS - plan.highS : plan.highS;
  const findings: string[] = [];
  let ok = true;
  const s = (x: number) => `${round(x * 1e6)} µs`;
  if (min !== undefined) {
    const good = pulseS >= min;
    ok &&= good;
    findings.push(
      `Gate pulse ${s(pulseS)} ${good ? "is at least" : "is shorter than"} the gate's minimum ${s(min)}.`,
    );
  }
  if (max !== undefined) {
    const good = pulseS <= max;
    ok &&= good;
    findings.push(
      `Gate pulse ${s(pulseS)} ${good ? "is at most" : "is longer than"} the gate's maximum ${s(max)}.`,
    );
  }
  if (trainPeriod !== undefined && trainPulses !== undefined) {
    const fitsPeriod = pulseS < trainPeriod;
    const start = plan.delayS ?? 0;
    const end = start + (trainPulses - 1) * trainPeriod + pulseS;
    const fitsHalf = end < plan.periodS;
    ok &&= fitsPeriod && fitsHalf;
    findings.push(
      !fitsPeriod
        ? `Pulse train: the ${s(pulseS)} pulse does not fit in the ${s(trainPeriod)} train period.`
        : fitsHalf
          ? `Pulse train of ${trainPulses} pulses every ${s(trainPeriod)} ends ${s(end)} after the start, within the ${s(plan.periodS)} period.`
          : `Pulse train of ${trainPulses} pulses every ${s(trainPeriod)} runs past the next input edge or period (${s(end)} > ${s(plan.periodS)}).`,
    );
  }
  return { ok, pulseS, findings };
}

function round(x: number): string {
  return Number(x.toPrecision(3)).toString();
}
