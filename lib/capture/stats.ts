import type { CaptureStats } from "./types";

/** Mean, sample standard deviation (n - 1), min, max of a list of intervals. */
export function summarize(values: ArrayLike<number>): CaptureStats {
  const count = values.length;
  if (count === 0) return { mean: NaN, std: NaN, min: NaN, max: NaN, count };
  let sum = 0;
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < count; i++) {
    const x = values[i];
    sum += x;
    if (x < min) min = x;
    if (x > max) max = x;
  }
  const mean = sum / count;
  let sq = 0;
  for (let i = 0; i < count; i++) sq += (values[i] - mean) ** 2;
  const std = count > 1 ? Math.sqrt(sq / (count - 1)) : 0;
  return { mean, std, min, max, count };
}
