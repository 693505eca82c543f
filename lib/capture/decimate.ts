// Display envelope: each point carries the min and max of the samples it
// covers, so a one-sample spike survives decimation (a plain every-Nth-sample
// pick would drop it).

import type { PlotPoint } from "./types";

export const PLOT_POINTS = 2000;

/** Envelope of samples [from, to) in at most `points` buckets of equal sample count. */
export function decimateEnvelope(
  t: Float64Array,
  v: Float64Array,
  points: number = PLOT_POINTS,
  from = 0,
  to = v.length,
): PlotPoint[] {
  const n = Math.max(0, to - from);
  const buckets = Math.min(n, Math.max(1, Math.floor(points)));
  const out: PlotPoint[] = [];
  for (let b = 0; b < buckets; b++) {
    const start = from + Math.floor((b * n) / buckets);
    const end = from + Math.floor(((b + 1) * n) / buckets);
    let lo = v[start];
    let hi = v[start];
    for (let i = start + 1; i < end; i++) {
      const x = v[i];
      if (x < lo) lo = x;
      else if (x > hi) hi = x;
    }
    out.push({ tS: t[start], minV: lo, maxV: hi });
  }
  return out;
}
