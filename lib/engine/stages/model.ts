// Shape shared by the stage models (one file per stage kind beside this one).
import { EngineError } from "../errors";
import { formatEng, type EngUnit } from "../units";
import type { OutputSignal, Stage, StageCheck, StageField } from "../stage-types";

export interface StageTiming {
  /** NaN when the stage does not oscillate */
  periodS: number;
  highS: number;
  lowS: number;
}

export interface ModelResult extends StageTiming {
  oscillates: boolean;
  /** error-level checks found while computing; empty when the stage runs */
  checks: readonly StageCheck[];
}

/** One exponential segment of the capacitor voltage: v(t) = toward + (from - toward) e^(-t/tau). */
export interface RcSegment {
  from: number;
  toward: number;
  /** seconds; 0 = the voltage sits at `toward` */
  tauS: number;
  durationS: number;
  /** output level during the segment, 0..1 (1 = active / high) */
  out: 0 | 1;
}

export interface StageModel<S extends Stage> {
  kind: S["kind"];
  label: string;
  outputSignal: OutputSignal;
  outputLabel: string;
  fields: StageField[];
  /** throws EngineError("invalid-stage") for inputs that contradict each other */
  crossCheck?(stage: S): void;
  /** fast path, also used per Monte Carlo sample: timing plus error checks */
  evaluate(stage: S): ModelResult;
  /** warnings about the nominal stage (unusual values, approximations) */
  warnings?(stage: S, result: ModelResult): StageCheck[];
  /** one period of the capacitor voltage, in circuit order (charge first) */
  segments(stage: S, result: ModelResult): { unit: "V" | "relative"; segments: RcSegment[] } | null;
}

/** Shared empty list: the fast path allocates nothing for checks. */
export const NO_CHECKS: readonly StageCheck[] = Object.freeze([]);

export const NO_OSCILLATION: StageTiming = { periodS: NaN, highS: NaN, lowS: NaN };

export function stopped(checks: readonly StageCheck[]): ModelResult {
  return { ...NO_OSCILLATION, oscillates: false, checks };
}

export function running(highS: number, lowS: number): ModelResult {
  const periodS = highS + lowS;
  // Extreme but positive parts (1e-12 Ω x 5e-324 F) can round the time to 0
  // or past the double range; that is no usable oscillation, not a NaN duty.
  if (!(periodS > 0 && Number.isFinite(periodS) && highS >= 0 && lowS >= 0)) {
    return stopped([
      errorCheck(
        "timing-out-of-range",
        "The part values give a time of zero or beyond any timer's range; check their units.",
      ),
    ]);
  }
  return { periodS, highS, lowS, oscillates: true, checks: NO_CHECKS };
}

export const fmt = (value: number, unit: EngUnit) => formatEng(value, unit, 3);

export function errorCheck(code: string, message: string, field?: string): StageCheck {
  return { level: "error", code, message, ...(field ? { field } : {}) };
}

export function warningCheck(code: string, message: string, field?: string): StageCheck {
  return { level: "warning", code, message, ...(field ? { field } : {}) };
}

export function invalidStage(field: string, message: string): EngineError {
  return new EngineError("invalid-stage", message, field);
}
