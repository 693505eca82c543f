// Nearest legal pwm compare value for a wanted high time.

/**
 * @param highCounts wanted high time in counter steps (H*f/(d*m))
 * @param periodCounts counter steps per period
 * @param step smallest high-time step in counts (1, or 0.25 for the PIC 10-bit duty)
 * @returns high time in counts, a multiple of step within [step, periodCounts - step]
 */
export function nearestHighCounts(highCounts: number, periodCounts: number, step: number): number {
  const lo = step;
  const hi = periodCounts - step;
  const x = highCounts / step;
  let best = lo;
  let bestErr = Infinity;
  for (const k of [Math.floor(x), Math.ceil(x)]) {
    const h = Math.min(hi, Math.max(lo, k * step));
    const err = Math.abs(h - highCounts);
    if (err < bestErr || (err === bestErr && h < best)) {
      best = h;
      bestErr = err;
    }
  }
  return best;
}
