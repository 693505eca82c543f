// Preferred number series for resistors and capacitors, IEC 60063:2015.
// The standard gives tables, not a formula: E24 and below carry rounded
// historical values (2.7, 3.3, 4.7 ... are not round(10^(i/24))), so every
// series is written out as the standard lists it, one decade from 1 to 10.
import { EngineError } from "./errors";

export type ESeriesName = "E6" | "E12" | "E24" | "E48" | "E96";

const E24 = [
  1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8,
  7.5, 8.2, 9.1,
];

const E96 = [
  1.0, 1.02, 1.05, 1.07, 1.1, 1.13, 1.15, 1.18, 1.21, 1.24, 1.27, 1.3, 1.33, 1.37, 1.4, 1.43, 1.47, 1.5, 1.54,
  1.58, 1.62, 1.65, 1.69, 1.74, 1.78, 1.82, 1.87, 1.91, 1.96, 2.0, 2.05, 2.1, 2.15, 2.21, 2.26, 2.32, 2.37,
  2.43, 2.49, 2.55, 2.61, 2.67, 2.74, 2.8, 2.87, 2.94, 3.01, 3.09, 3.16, 3.24, 3.32, 3.4, 3.48, 3.57, 3.65,
  3.74, 3.83, 3.92, 4.02, 4.12, 4.22, 4.32, 4.42, 4.53, 4.64, 4.75, 4.87, 4.99, 5.11, 5.23, 5.36, 5.49, 5.62,
  5.76, 5.9, 6.04, 6.19, 6.34, 6.49, 6.65, 6.81, 6.98, 7.15, 7.32, 7.5, 7.68, 7.87, 8.06, 8.25, 8.45, 8.66,
  8.87, 9.09, 9.31, 9.53, 9.76,
];

// E12 is every other E24 value, E6 every other E12, E48 every other E96
// (IEC 60063 builds the series that way).
const everyOther = (xs: number[]) => xs.filter((_, i) => i % 2 === 0);

export const E_SERIES: Readonly<Record<ESeriesName, readonly number[]>> = {
  E6: everyOther(everyOther(E24)),
  E12: everyOther(E24),
  E24,
  E48: everyOther(E96),
  E96,
};

/** Tolerance the series is made for (IEC 60063): E6 ±20 %, E12 ±10 %, E24 ±5 %, E48 ±2 %, E96 ±1 %. */
export const E_SERIES_TOLERANCE: Readonly<Record<ESeriesName, number>> = {
  E6: 0.2,
  E12: 0.1,
  E24: 0.05,
  E48: 0.02,
  E96: 0.01,
};

export interface StandardValue {
  value: number;
  /** (value - wanted) / wanted */
  errorRel: number;
}

// Scales a series value into a decade without accumulating float error:
// 4.7 * 1e3 and 47 * 1e2 must both print as 4700.
function scaled(mantissa: number, exp: number): number {
  const cents = Math.round(mantissa * 100);
  return exp >= 2 ? cents * 10 ** (exp - 2) : cents / 10 ** (2 - exp);
}

/** Nearest value of the series (on a log scale, as the series are spaced). */
export function nearestStandardValue(wanted: number, series: ESeriesName = "E24"): StandardValue {
  if (!Number.isFinite(wanted) || wanted <= 0) {
    throw new EngineError("invalid-value", "A standard value needs a positive finite number.");
  }
  const table = E_SERIES[series];
  if (!table) throw new EngineError("invalid-value", `Unknown series "${series}".`);
  const exp = Math.floor(Math.log10(wanted));
  let best = NaN;
  let bestDist = Infinity;
  // The candidates of this decade plus the first of the next and the last of the previous.
  for (const e of [exp - 1, exp, exp + 1]) {
    for (const m of table) {
      const v = scaled(m, e);
      const dist = Math.abs(Math.log(v / wanted));
      if (dist < bestDist - 1e-12) {
        best = v;
        bestDist = dist;
      }
    }
  }
  return { value: best, errorRel: (best - wanted) / wanted };
}

/** Every value of the series from `low` to `high` inclusive, with a relative 1e-12 of slack at both ends for bounds that carry float error. */
export function standardValuesBetween(series: ESeriesName, low: number, high: number): number[] {
  if (!(low > 0) || !(high >= low) || !Number.isFinite(high)) {
    throw new EngineError("invalid-value", "A value range needs 0 < low <= high.");
  }
  const out: number[] = [];
  const from = low * (1 - 1e-12);
  const to = high * (1 + 1e-12);
  // The decades come from the widened ends: a high bound a few ulps under 1000 still reaches 1000.
  for (let e = Math.floor(Math.log10(from)); e <= Math.floor(Math.log10(to)); e++) {
    for (const m of E_SERIES[series]) {
      const v = scaled(m, e);
      if (v >= from && v <= to) out.push(v);
    }
  }
  return out;
}
