// Sample points of the capacitor voltage and the output over two periods, for
// a sketch in the UI. Exact exponential segments of the stage model; the
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
  const span = model.outputSignal === "one-shot" ? total : 2 * total;
  const out: WaveformPoint[] = [];
  for (let i = 0; i < n; i++) {
    const tS = (span * i) / (n - 1);
    let t = tS % total;
    if (i === n - 1) t = total; // end exactly on the period boundary
    if (!shape) {
      // Measured: no capacitor, output high for the first highS of each period.
      out.push({ tS, capV: NaN, out: t < analysis.highS ? 1 : 0 });
      continue;
    }
    let seg = shape.segments[0];
    for (const s of shape.segments) {
      seg = s;
      if (t < s.durationS) break;
      t -= s.durationS;
    }
    const capV = seg.tauS > 0 ? seg.toward + (seg.from - seg.toward) * Math.exp(-t / seg.tauS) : seg.toward;
    out.push({ tS, capV, out: seg.out });
  }
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
  for (let i = 0; i < n; i++) {
    const tS = (2 * half * i) / (n - 1);
    const t = i === n - 1 ? half : tS % half;
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
