// State levels by the histogram method of IEEE Std 181-2011: the low and
// high states are the modes of the amplitude histogram taken separately in
// its lower and upper halves.

export interface StateLevels {
  low: number;
  high: number;
  min: number;
  max: number;
  bins: number;
}

/** Bin count: about sqrt(n), bounded (common practice, no source). */
export function binCount(n: number): number {
  const b = Math.round(Math.sqrt(n) / 2) * 2;
  return Math.min(1024, Math.max(16, b));
}

export function histogramStateLevels(v: Float64Array): StateLevels {
  const n = v.length;
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < n; i++) {
    const x = v[i];
    if (x < min) min = x;
    if (x > max) max = x;
  }
  const bins = binCount(n);
  if (!(max > min)) return { low: min, high: max, min, max, bins };
  const counts = new Uint32Array(bins);
  const sums = new Float64Array(bins);
  const scale = bins / (max - min);
  for (let i = 0; i < n; i++) {
    const x = v[i];
    let b = Math.floor((x - min) * scale);
    if (b >= bins) b = bins - 1;
    counts[b]++;
    sums[b] += x;
  }
  // The level is the mean of the samples in the modal bin rather than the
  // bin centre: the same mode, located finer than one bin width.
  const mode = (from: number, to: number): number => {
    let best = from;
    for (let b = from + 1; b < to; b++) if (counts[b] > counts[best]) best = b;
    return sums[best] / counts[best];
  };
  return { low: mode(0, bins / 2), high: mode(bins / 2, bins), min, max, bins };
}
