// Exhaustive reference solver, written from engine.md section 3 (and the
// tables in ./tables.ts), sharing no code with lib/engine/solver.
//
// Hardware modes: every (divider, count, mode factor); period = d*n*m/f.
// Order: least |period error|; then an integer divider (a fractional RP2040
// divider jitters single periods by one clock, engine.md section 2 notes);
// then most counts per period; then smallest divider; then smaller factor.
// Small timers: every count is tried. STM32/RP2040 (65536 x 65536 pairs):
// every divider, and for each the counts within 2 of the ideal d*n*m = T*f
// (|d*n*m - T*f| grows with the distance from the ideal, so nothing outside
// can be closer).
//
// Interrupt plans: interval d*n >= 500 CPU cycles (common practice), s >= 2
// interrupts per period, each (d, n) with both whole s around T*f/(d*n).
// Order: least period error, least high-time error, longest interval,
// smallest divider. High interrupts: nearest in 1..s-1, ties to fewer.
import type { RefTimer } from "./tables";

export interface RefHardware {
  divider: number;
  periodCounts: number;
  modeFactor: number;
  highCounts: number;
  errorCycles: number;
}

export interface RefIsr {
  divider: number;
  periodCounts: number;
  softwareDivider: number;
  highCounts: number;
  errorCycles: number;
}

function hardwareBetter(a: RefHardware, b: RefHardware): boolean {
  if (a.errorCycles !== b.errorCycles) return a.errorCycles < b.errorCycles;
  const ai = Number.isInteger(a.divider);
  if (ai !== Number.isInteger(b.divider)) return ai;
  if (a.periodCounts !== b.periodCounts) return a.periodCounts > b.periodCounts;
  if (a.divider !== b.divider) return a.divider < b.divider;
  return a.modeFactor < b.modeFactor;
}

/** Nearest legal high time in counts: a multiple of step in [step, n - step], ties to the shorter. */
export function refHighCounts(wanted: number, n: number, step: number): number {
  let best = step;
  let bestErr = Infinity;
  for (let k = 1; k * step <= n - step + 1e-12; k++) {
    const err = Math.abs(k * step - wanted);
    if (err < bestErr) {
      best = k * step;
      bestErr = err;
    }
    if (k * step > wanted) break; // errors only grow from here
  }
  return best;
}

export function refHardware(
  t: RefTimer,
  mode: "pwm" | "toggle",
  periodS: number,
  highS: number,
): RefHardware | null {
  const range = mode === "pwm" ? t.pwm : t.toggle;
  if (!range) return null;
  const factors = mode === "pwm" ? t.pwm!.factors : [2]; // toggle: two compare matches per output period
  const target = periodS * t.clockHz;
  let best: RefHardware | null = null;
  for (const m of factors)
    for (const d of t.dividers) {
      let from = range.min;
      let to = range.max;
      if (!t.small) {
        const ideal = target / (d * m);
        from = Math.max(range.min, Math.floor(ideal) - 2);
        to = Math.min(range.max, Math.ceil(ideal) + 2);
      }
      for (let n = from; n <= to; n++) {
        const c: RefHardware = {
          divider: d,
          periodCounts: n,
          modeFactor: m,
          highCounts: 0,
          errorCycles: Math.abs(d * n * m - target),
        };
        if (!best || hardwareBetter(c, best)) best = c;
      }
    }
  if (!best) return null;
  best.highCounts =
    mode === "toggle"
      ? best.periodCounts
      : refHighCounts((highS * t.clockHz) / (best.divider * best.modeFactor), best.periodCounts, t.highStep);
  return best;
}

export function refIsr(t: RefTimer, periodS: number, highS: number): RefIsr | null {
  if (!t.isr) return null;
  const target = periodS * t.clockHz;
  const high = highS * t.clockHz;
  const minInterval = 500 * t.clocksPerCpuCycle;
  let best: (RefIsr & { highErr: number; interval: number }) | null = null;
  for (const d of t.dividers)
    for (let n = t.isr.min; n <= t.isr.max; n++) {
      const interval = d * n;
      if (interval < minInterval) continue;
      const x = target / interval;
      for (const s of [Math.floor(x), Math.floor(x) + 1]) {
        if (s < 2) continue;
        const err = Math.abs(interval * s - target);
        if (best && err > best.errorCycles) continue;
        let h = Math.min(s - 1, Math.max(1, Math.round(high / interval)));
        // Math.round breaks .5 upwards; the rule is ties to fewer
        if (h > 1 && Math.abs((h - 1) * interval - high) <= Math.abs(h * interval - high)) h -= 1;
        const highErr = Math.abs(h * interval - high);
        const c = {
          divider: d,
          periodCounts: n,
          softwareDivider: s,
          highCounts: h,
          errorCycles: err,
          highErr,
          interval,
        };
        const better =
          !best ||
          err < best.errorCycles ||
          (err === best.errorCycles &&
            (highErr < best.highErr ||
              (highErr === best.highErr &&
                (interval > best.interval || (interval === best.interval && d < best.divider)))));
        if (better) best = c;
      }
    }
  return best;
}
