// Exact best hardware setting (engine.md section 3): for each legal divider
// d and mode factor m the best counter value is floor or ceil of
// T*f/(d*m), clamped to the counter range, so enumerating dividers finds the
// optimum over every legal (d, n, m). Errors are kept in divider quanta
// (1/16 clock for the RP2040) so that ties compare exactly.
import type { TimerSpec } from "../devices/spec";

export interface HardwareChoice {
  /** Divider in clock cycles per count. */
  divider: number;
  periodCounts: number;
  modeFactor: 1 | 2;
  /** |achieved - target| in divider quanta (clock cycles / dividerQuantum). */
  errorQuanta: number;
  /** The target lies within half a count of the counter range for this divider. */
  inRange: boolean;
}

/**
 * Ordering: least error, then an integer divider (a fractional RP2040 divider
 * makes single periods jitter by one clock), then most counts per period,
 * then smallest divider, then smaller mode factor.
 */
export function betterHardware(a: HardwareChoice, b: HardwareChoice): boolean {
  if (a.errorQuanta !== b.errorQuanta) return a.errorQuanta < b.errorQuanta;
  const ai = Number.isInteger(a.divider);
  if (ai !== Number.isInteger(b.divider)) return ai;
  if (a.periodCounts !== b.periodCounts) return a.periodCounts > b.periodCounts;
  if (a.divider !== b.divider) return a.divider < b.divider;
  return a.modeFactor < b.modeFactor;
}

/**
 * @param targetQuanta target period * clockHz * dividerQuantum
 */
export function bestHardware(
  timer: TimerSpec,
  mode: "pwm" | "toggle",
  targetQuanta: number,
): HardwareChoice | null {
  const range = timer.counts[mode];
  const factors = timer.modeFactors[mode];
  if (!range || !factors) return null;
  const q = timer.dividerQuantum;
  let best: HardwareChoice | null = null;
  // Hot loop (65 536 dividers on the STM32): compare plain numbers and build
  // a choice object only when a candidate wins.
  const consider = (d: number, n: number, m: 1 | 2, step: number, inRange: boolean) => {
    const errorQuanta = Math.abs(step * n - targetQuanta);
    if (best && errorQuanta > best.errorQuanta) return;
    const c: HardwareChoice = { divider: d, periodCounts: n, modeFactor: m, errorQuanta, inRange };
    if (!best || betterHardware(c, best)) best = c;
  };
  // Every achievable period is a whole number of quanta, so no setting can be
  // closer than the target's distance to the nearest whole number. Once the
  // best so far sits at that bound with an integer divider, a candidate can
  // only win the tie (betterHardware) with more counts per period; dividers
  // run in ascending order, so when a divider's most possible counts fall
  // below the best's, every later divider's do too and the loop stops.
  const lowerBound = Math.abs(targetQuanta - Math.round(targetQuanta)) + 1e-9;
  for (const m of factors) {
    for (const d of timer.dividers) {
      const step = Math.round(d * q) * m; // quanta per count
      const b = best as HardwareChoice | null;
      if (
        b &&
        b.errorQuanta <= lowerBound &&
        Number.isInteger(b.divider) &&
        Math.max(range.min, Math.min(range.max, Math.ceil(targetQuanta / step))) < b.periodCounts
      ) {
        break;
      }
      const x = targetQuanta / step;
      const lo = Math.min(range.max, Math.max(range.min, Math.floor(x)));
      const hi = Math.min(range.max, Math.max(range.min, Math.ceil(x)));
      const inRange = x >= range.min - 0.5 && x <= range.max + 0.5;
      consider(d, lo, m, step, inRange);
      if (hi !== lo) consider(d, hi, m, step, inRange);
    }
  }
  return best;
}
