// Points of the capacitor voltage and the output over two periods, for a
// sketch in the UI. Exact exponential segments of the stage model, sampled at
// their edges (event-based) so narrow pulses are never stepped over; the
// sketch starts at the beginning of the charge phase.
import type { Stage, StageAnalysis } from "./stage-types";
import { modelOf } from "./stages";
import { withDefaults } from "./analyze-stage";
import { syncCapacitorV } from "./stages/sync";
import { syncCircuitOf, syncOf, type SyncableStage } from "./stages/synced";
import type { MainsSync } from "./stage-types";

export interface WaveformPoint {
  tS: number;
  /** volts, or relative to the supply (555 one-shot) / to Vsat (op-amp); NaN for a measured stage */
  capV: number;
  /** output level 0..1 (1 = high / active) */
  out: number;
}

export function stageWaveform(stage: Stage, analysis: StageAnalysis, points = 400): WaveformPoint[] {
  if (!analysis.oscillates || !(analysis.periodS > 0)) return [];
  const n = Math.max(2, Math.floor(points));
  const full = withDefaults(stage);
  if (syncOf(full) && analysis.sync)
    return syncWaveform(full as SyncableStage & { sync: MainsSync }, analysis, n);
  const model = modelOf(full);
  const result = { ...analysis, checks: [] };
  const shape = model.segments(full, result);
  const total = shape ? shape.segments.reduce((a, s) => a + s.durationS, 0) : analysis.periodS;
  // A one-shot makes one pulse per trigger: one pulse and the idle after it, no invented repeat.
  const repeats = model.outputSignal === "one-shot" ? 1 : 2;
  const durations = shape ? shape.segments.map((s) => s.durationS) : [analysis.highS, total - analysis.highS];
  return eventTimes(total, repeats, durations, n).map(({ tS, t }) => {
    if (!shape) {
      // Measured: no capacitor, output high for the first highS of each period.
      return { tS, capV: NaN, out: t < analysis.highS ? 1 : 0 };
    }
    let seg = shape.segments[0];
    let u = t;
    for (const s of shape.segments) {
      seg = s;
      if (u < s.durationS) break;
      u -= s.durationS;
    }
    if (u > seg.durationS) u = seg.durationS; // the period's last instant
    const capV = seg.tauS > 0 ? seg.toward + (seg.from - seg.toward) * Math.exp(-u / seg.tauS) : seg.toward;
    return { tS, capV, out: seg.out };
  });
}

/** Points inside each segment besides its ends, so a narrow pulse keeps its shape. */
const POINTS_PER_SEGMENT = 16;

/**
 * Sample instants built from the edges, not an even grid: every segment
 * boundary (and the instant just before it, so a step draws upright), a few
 * points inside every segment however short, plus `n` even points for the
 * smooth parts. A 16.7 us pulse in a 50 ms period is drawn, where 800 even
 * points (one per 125 us) would step over it. Returns global time and the
 * time inside the period.
 */
function eventTimes(
  period: number,
  repeats: number,
  durations: number[],
  n: number,
): { tS: number; t: number }[] {
  const local: number[] = [];
  let at = 0;
  for (const d of durations) {
    if (!(d > 0)) continue;
    for (let j = 0; j < POINTS_PER_SEGMENT; j++) local.push(at + (d * j) / POINTS_PER_SEGMENT);
    at += d;
    // Just before the edge: the old level's last instant.
    local.push(Math.max(0, at - Math.min(d, period) * 1e-6));
  }
  const even = Math.max(2, Math.floor(n / repeats));
  for (let i = 0; i < even; i++) local.push((period * i) / even);
  const uniq = [...new Set(local.filter((t) => t >= 0 && t < period))].sort((a, b) => a - b);
  const out: { tS: number; t: number }[] = [];
  for (let k = 0; k < repeats; k++) for (const t of uniq) out.push({ tS: k * period + t, t });
  // End exactly on the period boundary, at the level the period ends with.
  out.push({ tS: repeats * period, t: period });
  return out;
}

/**
 * Two half cycles of a mains-synchronised stage: the charge from the zero
 * crossing (./stages/sync.ts), the gate pulse, and after it no capacitor
 * trace (NaN): the element may fire again, but the thyristor is already on.
 */
function syncWaveform(
  stage: SyncableStage & { sync: MainsSync },
  analysis: StageAnalysis,
  n: number,
): WaveformPoint[] {
  const half = analysis.sync!.halfCycleS;
  const delay = analysis.sync!.firingDelayS;
  const model = modelOf(stage);
  const shape = model.segments(stage, { ...analysis, checks: [] });
  const discharge = shape?.segments[1];
  const circuit = syncCircuitOf(stage);
  const out: WaveformPoint[] = [];
  const durations = [delay, analysis.highS, half - delay - analysis.highS];
  for (const { tS, t } of eventTimes(half, 2, durations, n)) {
    if (t < delay) out.push({ tS, capV: syncCapacitorV(circuit, t), out: 0 });
    else if (t < delay + analysis.highS && discharge) {
      const u = t - delay;
      out.push({
        tS,
        capV: discharge.toward + (discharge.from - discharge.toward) * Math.exp(-u / discharge.tauS),
        out: 1,
      });
    } else out.push({ tS, capV: NaN, out: 0 });
  }
  return out;
}
