// Pulse measurement of a parsed trace per IEEE Std 181-2011: histogram state
// levels, 10/50/90 % reference levels, 50 % transitions with hysteresis,
// period (rise to next rise), pulse duration (rise to next fall), duty.

import { decimateEnvelope } from "./decimate";
import { CaptureError } from "./errors";
import { parseCapture } from "./parse-lines";
import { histogramStateLevels } from "./state-levels";
import { summarize } from "./stats";
import { findTransitions } from "./transitions";
import { measureRamp, type RampMeasurement } from "./ramp";
import type { CaptureMeasurement, CaptureOptions, CaptureTrace, CaptureWarning } from "./types";

/** Edges returned for display; the stats use all of them. */
export const MAX_EDGES = 2000;

/** Fewer sample intervals than this per 10-90 % edge and the edge time is
 *  mostly sampling (common practice, no source). */
const MIN_SAMPLES_PER_EDGE = 3;

export function measureTrace(trace: CaptureTrace): CaptureMeasurement {
  const { t, v } = trace;
  const n = v.length;
  if (n < 2) {
    throw new CaptureError("no-period", trace.firstDataLine, `only ${n} sample; a period needs many`);
  }
  // A capacitor ramp (UJT emitter) has no two states: measure its cycles instead.
  const ramp = measureRamp(t, v);
  if (ramp) return rampResult(trace, ramp);
  const levels = histogramStateLevels(v);
  const amplitude = levels.high - levels.low;
  if (!(amplitude > 0)) {
    throw new CaptureError("flat", null, `the trace stays at ${levels.min} V: no transitions to measure`);
  }
  const ref = {
    p10: levels.low + 0.1 * amplitude,
    p50: levels.low + 0.5 * amplitude,
    p90: levels.low + 0.9 * amplitude,
  };
  const transitions = findTransitions(t, v, ref);

  const rises: number[] = [];
  const periods: number[] = [];
  const highs: number[] = [];
  const lows: number[] = [];
  const riseTimes: number[] = [];
  const fallTimes: number[] = [];
  let lastRise = NaN;
  let lastFall = NaN;
  for (const tr of transitions) {
    if (tr.kind === "rise") {
      if (!Number.isNaN(lastRise)) periods.push(tr.t50 - lastRise);
      if (!Number.isNaN(lastFall)) lows.push(tr.t50 - lastFall);
      lastRise = tr.t50;
      rises.push(tr.t50);
      riseTimes.push(tr.duration);
    } else {
      if (!Number.isNaN(lastRise)) highs.push(tr.t50 - lastRise);
      lastFall = tr.t50;
      fallTimes.push(tr.duration);
    }
  }
  if (rises.length < 2) {
    throw new CaptureError(
      "no-period",
      null,
      `${rises.length} rising edge(s) through the 50 % level (${ref.p50.toPrecision(4)} V); a period needs two`,
    );
  }

  const periodS = summarize(periods);
  const highS = summarize(highs);
  const rise = summarize(riseTimes);
  const fall = summarize(fallTimes);
  const sampleIntervalS = (t[n - 1] - t[0]) / (n - 1);
  const warnings: CaptureWarning[] = [...trace.warnings];
  if (periodS.count < 2) {
    warnings.push({
      code: "few-periods",
      message: `only ${periodS.count} full period in the capture; spread needs at least 2`,
    });
  }
  if (Math.min(rise.mean, fall.mean) < MIN_SAMPLES_PER_EDGE * sampleIntervalS) {
    warnings.push({
      code: "fast-edges",
      message: `edges span fewer than ${MIN_SAMPLES_PER_EDGE} sample intervals (${sampleIntervalS} s); rise and fall times are limited by the sample rate`,
    });
  }
  if (transitions.length > MAX_EDGES) {
    warnings.push({
      code: "edges-capped",
      message: `${transitions.length} edges found; the first ${MAX_EDGES} are listed`,
    });
  }

  return {
    waveform: "pulse",
    samples: n,
    sampleIntervalS,
    startS: t[0],
    durationS: t[n - 1] - t[0],
    columns: trace.columns,
    measuredColumn: trace.measuredColumn,
    scaling: trace.scaling,
    header: trace.header,
    lowLevelV: levels.low,
    highLevelV: levels.high,
    amplitudeV: amplitude,
    referenceV: ref,
    periodS,
    highS,
    lowS: summarize(lows),
    frequencyHz: 1 / periodS.mean,
    duty: highS.mean / periodS.mean,
    riseS: rise.mean,
    fallS: fall.mean,
    riseTimes: rise,
    fallTimes: fall,
    edges: transitions.slice(0, MAX_EDGES).map((tr) => ({ tS: tr.t50, kind: tr.kind })),
    edgesTotal: transitions.length,
    plot: decimateEnvelope(t, v),
    warnings,
  };
}

/** Parses an export and measures its first voltage column (or the one chosen
 *  in options). Throws CaptureError on unreadable or unmeasurable input. */
export async function measureCsv(
  source: string | AsyncIterable<Uint8Array | string>,
  options: CaptureOptions = {},
): Promise<CaptureMeasurement> {
  return measureTrace(await parseCapture(source, options));
}

/**
 * A ramp as a measurement (capture.md "Ramps"): levels are the mean release
 * (valley) and trip (peak) voltages, periodS runs between successive trips,
 * riseS is the charge time and fallS the discharge time. The stage's output
 * pulse flows while the capacitor discharges, so highS is the discharge time.
 */
function rampResult(trace: CaptureTrace, r: RampMeasurement): CaptureMeasurement {
  const { t, v } = trace;
  const n = v.length;
  const low = r.valleyV.mean;
  const high = r.peakV.mean;
  const amplitude = high - low;
  const sampleIntervalS = (t[n - 1] - t[0]) / (n - 1);
  const warnings: CaptureWarning[] = [...trace.warnings];
  if (r.periodS.count < 2)
    warnings.push({
      code: "few-periods",
      message: `only ${r.periodS.count} full period in the capture; spread needs at least 2`,
    });
  return {
    waveform: "ramp",
    peakV: r.peakV,
    valleyV: r.valleyV,
    samples: n,
    sampleIntervalS,
    startS: t[0],
    durationS: t[n - 1] - t[0],
    columns: trace.columns,
    measuredColumn: trace.measuredColumn,
    scaling: trace.scaling,
    header: trace.header,
    lowLevelV: low,
    highLevelV: high,
    amplitudeV: amplitude,
    referenceV: { p10: low + 0.1 * amplitude, p50: low + 0.5 * amplitude, p90: low + 0.9 * amplitude },
    periodS: r.periodS,
    highS: r.dischargeS,
    lowS: r.chargeS,
    frequencyHz: 1 / r.periodS.mean,
    duty: r.dischargeS.mean / r.periodS.mean,
    riseS: r.chargeS.mean,
    fallS: r.dischargeS.mean,
    riseTimes: r.chargeS,
    fallTimes: r.dischargeS,
    edges: r.peakTimesS.slice(0, MAX_EDGES).map((tS) => ({ tS, kind: "fall" as const })),
    edgesTotal: r.peakTimesS.length,
    plot: decimateEnvelope(t, v),
    warnings,
  };
}
