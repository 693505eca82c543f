// Tolerance spread of a timing model: corner analysis (every min/max
// combination of the toleranced parameters) and seeded Monte Carlo.
// Sampling: each parameter is normal with its tolerance at 3 sigma, truncated
// at the tolerance limits, with separate sigmas below and above nominal for
// asymmetric tolerances (common practice, no source). The truncation keeps
// every sample inside the corner box, so for monotonic models the corner
// extremes bracket every Monte Carlo result.
import { EngineError } from "./errors";
import type { Histogram, MinMax, Quantiles, Tolerance, Tolerances } from "./stage-types";

export const DEFAULT_SAMPLES = 10_000;
export const DEFAULT_SEED = 1;
export const DEFAULT_BINS = 40;
export const MAX_CORNER_PARAMS = 12;

export type Timing = { periodS: number; highS: number };
/** Evaluates a parameter set; NaN (or any non-finite) period = no oscillation. */
export type TimingFn<P> = (params: P) => Timing;

export function toleranceBounds(t: Tolerance): { minus: number; plus: number } {
  return typeof t === "number" ? { minus: t, plus: t } : { minus: t[0], plus: t[1] };
}

/** Mulberry32: a small 32-bit PRNG, the same sequence in every JS engine. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Fills `out` with standard normal deviates truncated to |z| <= 3 (Marsaglia
 * polar method: only log and sqrt, so results do not depend on an engine's
 * sin/cos). Both deviates of a pair are used, in order.
 */
export function fillTruncatedNormal(random: () => number, out: Float64Array): Float64Array {
  let i = 0;
  const n = out.length;
  while (i < n) {
    const u = 2 * random() - 1;
    const v = 2 * random() - 1;
    const s = u * u + v * v;
    if (s >= 1 || s === 0) continue;
    const k = Math.sqrt((-2 * Math.log(s)) / s);
    const a = u * k;
    const b = v * k;
    if (a >= -3 && a <= 3) out[i++] = a;
    if (i < n && b >= -3 && b <= 3) out[i++] = b;
  }
  return out;
}

function entries<P>(nominal: P, tolerances: Tolerances) {
  const list = Object.entries(tolerances)
    .filter(([, t]) => t !== undefined)
    .map(([key, t]) => {
      const base = (nominal as Record<string, unknown>)[key];
      if (typeof base !== "number") {
        throw new EngineError(
          "invalid-stage",
          `A tolerance is given for "${key}", which has no numeric value.`,
          `tolerances.${key}`,
        );
      }
      const { minus, plus } = toleranceBounds(t as Tolerance);
      return { key, base, low: base * (1 - minus), high: base * (1 + plus) };
    });
  return list;
}

export interface CornerResult {
  count: number;
  /** corners at which the model gives no timing */
  failed: number;
  periodS: MinMax;
  highS: MinMax;
}

/** Every min/max combination (2^n, n <= 12). */
export function cornerSpread<P extends object>(
  nominal: P,
  tolerances: Tolerances,
  fn: TimingFn<P>,
): CornerResult {
  const list = entries(nominal, tolerances);
  if (list.length > MAX_CORNER_PARAMS) {
    throw new EngineError(
      "invalid-stage",
      `At most ${MAX_CORNER_PARAMS} toleranced parameters.`,
      "tolerances",
    );
  }
  const p = { ...nominal } as Record<string, unknown>;
  const period = { min: Infinity, max: -Infinity };
  const high = { min: Infinity, max: -Infinity };
  let failed = 0;
  const count = 1 << list.length;
  for (let mask = 0; mask < count; mask++) {
    for (let i = 0; i < list.length; i++) p[list[i].key] = mask & (1 << i) ? list[i].high : list[i].low;
    const t = fn(p as P);
    if (!Number.isFinite(t.periodS)) {
      failed++;
      continue;
    }
    if (t.periodS < period.min) period.min = t.periodS;
    if (t.periodS > period.max) period.max = t.periodS;
    if (t.highS < high.min) high.min = t.highS;
    if (t.highS > high.max) high.max = t.highS;
  }
  if (failed === count)
    return { count, failed, periodS: { min: NaN, max: NaN }, highS: { min: NaN, max: NaN } };
  return { count, failed, periodS: period, highS: high };
}

/** Quantile of sorted data, linear interpolation between order statistics. */
export function quantile(sorted: ArrayLike<number>, q: number): number {
  const n = sorted.length;
  if (n === 0) return NaN;
  const pos = (n - 1) * q;
  const i = Math.floor(pos);
  const frac = pos - i;
  return i + 1 < n ? sorted[i] + frac * (sorted[i + 1] - sorted[i]) : sorted[i];
}

export function quantiles(sorted: ArrayLike<number>): Quantiles {
  return {
    median: quantile(sorted, 0.5),
    q00135: quantile(sorted, 0.00135),
    q99865: quantile(sorted, 0.99865),
  };
}

export function histogram(sorted: ArrayLike<number>, bins = DEFAULT_BINS): Histogram {
  const n = sorted.length;
  if (n === 0) return { binStartS: NaN, binWidthS: NaN, counts: [] };
  const lo = sorted[0];
  const hi = sorted[n - 1];
  const width = hi > lo ? (hi - lo) / bins : Math.abs(lo) * 1e-9 || 1e-12;
  const counts = new Array<number>(bins).fill(0);
  for (let i = 0; i < n; i++) counts[Math.min(bins - 1, Math.floor((sorted[i] - lo) / width))]++;
  return { binStartS: lo, binWidthS: width, counts };
}

export interface MonteCarloOptions {
  samples?: number;
  seed?: number;
  bins?: number;
}

export interface MonteCarloResult {
  samples: number;
  seed: number;
  failed: number;
  periodS: Quantiles;
  highS: Quantiles;
  histogram: Histogram;
  /** sorted periods of the samples that gave a timing */
  sortedPeriodS: Float64Array;
  sortedHighS: Float64Array;
}

export function monteCarloSpread<P extends object>(
  nominal: P,
  tolerances: Tolerances,
  fn: TimingFn<P>,
  options: MonteCarloOptions = {},
): MonteCarloResult {
  const samples = options.samples ?? DEFAULT_SAMPLES;
  const seed = options.seed ?? DEFAULT_SEED;
  if (!Number.isInteger(samples) || samples < 1 || samples > 1_000_000) {
    throw new EngineError(
      "invalid-stage",
      "Monte Carlo samples must be an integer from 1 to 1 000 000.",
      "samples",
    );
  }
  if (!Number.isInteger(seed)) throw new EngineError("invalid-stage", "The seed must be an integer.", "seed");
  const list = entries(nominal, tolerances);
  // All deviates first, sample-major, so the same seed gives the same numbers
  // whatever the model does with them.
  const k = list.length;
  const dev = fillTruncatedNormal(seededRandom(seed), new Float64Array(samples * k));
  const p = { ...nominal } as Record<string, unknown>;
  const period = new Float64Array(samples);
  const high = new Float64Array(samples);
  let ok = 0;
  for (let n = 0; n < samples; n++) {
    for (let j = 0; j < k; j++) {
      const e = list[j];
      const d = dev[n * k + j];
      p[e.key] = d < 0 ? e.base + ((e.base - e.low) * d) / 3 : e.base + ((e.high - e.base) * d) / 3;
    }
    const t = fn(p as P);
    if (!Number.isFinite(t.periodS)) continue;
    period[ok] = t.periodS;
    high[ok] = t.highS;
    ok++;
  }
  const sortedPeriodS = period.subarray(0, ok).sort();
  const sortedHighS = high.subarray(0, ok).sort();
  return {
    samples,
    seed,
    failed: samples - ok,
    periodS: quantiles(sortedPeriodS),
    highS: quantiles(sortedHighS),
    histogram: histogram(sortedPeriodS, options.bins),
    sortedPeriodS,
    sortedHighS,
  };
}
