// Order statistics for benchmark samples.

/**
 * Percentile by linear interpolation between closest ranks (the "R-7" rule,
 * Hyndman & Fan 1996, the default of R and NumPy): rank h = (n - 1) * p / 100.
 */
export function percentile(values: readonly number[], p: number): number {
  if (values.length === 0) return NaN;
  if (!(p >= 0 && p <= 100)) throw new RangeError(`percentile ${p} is outside 0..100`);
  const sorted = [...values].sort((a, b) => a - b);
  const h = ((sorted.length - 1) * p) / 100;
  const lo = Math.floor(h);
  const hi = Math.ceil(h);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

export const median = (values: readonly number[]) => percentile(values, 50);

/** Runs `fn` `warmup` times unmeasured, then `runs` times; returns each run's milliseconds. */
export async function timeRuns(fn: () => unknown, runs: number, warmup: number): Promise<number[]> {
  for (let i = 0; i < warmup; i++) await fn();
  const out: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    await fn();
    out.push(performance.now() - t0);
  }
  return out;
}
