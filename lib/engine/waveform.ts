// Sample points of the capacitor voltage and the output over two periods, for
// a sketch in the UI. Exact exponential segments of the stage model; the
// sketch starts at the beginning of the charge phase.
import type { Stage, StageAnalysis } from "./stage-types";
import { modelOf } from "./stages";
import { withDefaults } from "./analyze-stage";

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
  const model = modelOf(full);
  const result = { ...analysis, checks: [] };
  const shape = model.segments(full, result);
  const total = shape ? shape.segments.reduce((a, s) => a + s.durationS, 0) : analysis.periodS;
  const span = 2 * total;
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
