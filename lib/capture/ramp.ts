// Ramp waveforms (capture.md "Ramps"): a relaxation stage's capacitor (a UJT
// emitter) charges slowly and discharges fast, so the two-state histogram of
// IEEE Std 181-2011 does not apply. Cycles are found with hysteresis between
// 20 % and 80 % of the trace's span; each cycle's trip (peak) and release
// (valley) voltages are the extremes between those crossings, the charge time
// runs valley -> peak and the discharge time peak -> valley. The 20/80 %
// thresholds and the 5:1 slope ratio are common practice, no source.
import { summarize } from "./stats";
import type { CaptureStats } from "./types";

/** A ramp charges at least this many times longer than it discharges. */
const RAMP_RATIO = 5;

export interface RampMeasurement {
  peakV: CaptureStats;
  valleyV: CaptureStats;
  /** Successive trip instants (the start of each fall). */
  periodS: CaptureStats;
  /** Valley to the next peak. */
  chargeS: CaptureStats;
  /** Peak to the next valley. */
  dischargeS: CaptureStats;
  peakTimesS: number[];
}

interface Extreme {
  kind: "peak" | "valley";
  i: number;
}

/** Alternating confirmed extremes; the first (maybe cut by the record's start) is dropped. */
function extremes(v: ArrayLike<number>): Extreme[] {
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < v.length; i++) {
    if (v[i] < min) min = v[i];
    if (v[i] > max) max = v[i];
  }
  const span = max - min;
  if (!(span > 0)) return [];
  const lo = min + 0.2 * span;
  const hi = min + 0.8 * span;
  const out: Extreme[] = [];
  let rising = v[0] < min + 0.5 * span;
  let best = 0;
  for (let i = 0; i < v.length; i++) {
    if (rising) {
      if (v[i] > v[best]) best = i;
      if (v[i] <= lo && v[best] >= hi) {
        out.push({ kind: "peak", i: best });
        rising = false;
        best = i;
      }
    } else {
      if (v[i] < v[best]) best = i;
      if (v[i] >= hi && v[best] <= lo) {
        out.push({ kind: "valley", i: best });
        rising = true;
        best = i;
      }
    }
  }
  return out.slice(1);
}

/** A ramp spends at least this share of its samples between 20 % and 80 %; a pulse train almost none. */
const MIN_MIDDLE_SHARE = 0.3;

function middleShare(v: ArrayLike<number>): number {
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < v.length; i++) {
    if (v[i] < min) min = v[i];
    if (v[i] > max) max = v[i];
  }
  const lo = min + 0.2 * (max - min);
  const hi = min + 0.8 * (max - min);
  let inside = 0;
  for (let i = 0; i < v.length; i++) if (v[i] > lo && v[i] < hi) inside++;
  return inside / v.length;
}

/** The ramp's cycles, or null when the trace is not a slow-rise / fast-fall ramp. */
export function measureRamp(t: ArrayLike<number>, v: ArrayLike<number>): RampMeasurement | null {
  if (v.length < 4 || middleShare(v) < MIN_MIDDLE_SHARE) return null;
  const ex = extremes(v);
  const charge: number[] = [];
  const discharge: number[] = [];
  const peaks: number[] = [];
  const valleys: number[] = [];
  const peakTimes: number[] = [];
  for (let k = 0; k < ex.length; k++) {
    const e = ex[k];
    const prev = ex[k - 1];
    if (e.kind === "peak") {
      peaks.push(v[e.i]);
      peakTimes.push(t[e.i]);
      if (prev) charge.push(t[e.i] - t[prev.i]);
    } else {
      valleys.push(v[e.i]);
      if (prev) discharge.push(t[e.i] - t[prev.i]);
    }
  }
  if (peakTimes.length < 2 || charge.length === 0 || discharge.length === 0) return null;
  const chargeS = summarize(charge);
  const dischargeS = summarize(discharge);
  if (!(chargeS.mean >= RAMP_RATIO * dischargeS.mean)) return null;
  const periods = peakTimes.slice(1).map((x, i) => x - peakTimes[i]);
  return {
    peakV: summarize(peaks),
    valleyV: summarize(valleys),
    periodS: summarize(periods),
    chargeS,
    dischargeS,
    peakTimesS: peakTimes,
  };
}

/**
 * A UJT's intrinsic standoff ratio from the measured trip voltage: Vp = eta *
 * VBB + VD (the emitter diode drop), so eta = (Vp - VD) / VBB (2N2646 data
 * sheet, peak-point voltage; the 0.6 V drop is common practice, no source).
 */
export function standoffRatio(peakV: number, supplyV: number, diodeV = 0.6): number {
  return (peakV - diodeV) / supplyV;
}
