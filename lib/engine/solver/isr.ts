// Exact best interrupt plan with a software divider. Totals K = d*n*s clock
// cycles are integers, so the least period error is reached by the integer K
// nearest the target that factors as (interval d*n) * (interrupts s). Totals
// are tried in order of distance from the target; for each, every divisor
// is a candidate interval (>= 500 CPU cycles, common practice: room for the
// handler) with s >= 2 interrupts (one edge each way). Among the totals at
// the least distance: least high-time error, then longest interval, then
// smallest divider (engine.md section 3).
import type { TimerSpec } from "../devices/spec";
import { divisors } from "./factor";

export const MAX_SOFTWARE_DIVIDER = 2 ** 32 - 1;

export interface IsrChoice {
  divider: number;
  periodCounts: number;
  softwareDivider: number;
  /** Interrupts the output stays high. */
  highCounts: number;
  intervalCycles: number;
  periodErrorCycles: number;
  highErrorCycles: number;
}

export function betterIsr(a: IsrChoice, b: IsrChoice): boolean {
  if (a.periodErrorCycles !== b.periodErrorCycles) return a.periodErrorCycles < b.periodErrorCycles;
  if (a.highErrorCycles !== b.highErrorCycles) return a.highErrorCycles < b.highErrorCycles;
  if (a.intervalCycles !== b.intervalCycles) return a.intervalCycles > b.intervalCycles;
  return a.divider < b.divider;
}

/** Nearest number of high interrupts in 1..s-1; ties to the lower count. */
export function bestHighInterrupts(interval: number, s: number, highCycles: number): [number, number] {
  const x = highCycles / interval;
  let best: [number, number] = [0, Infinity];
  for (const h of [Math.floor(x), Math.ceil(x)]) {
    const hc = Math.min(s - 1, Math.max(1, h));
    const err = Math.abs(hc * interval - highCycles);
    if (err < best[1] || (err === best[1] && hc < best[0])) best = [hc, err];
  }
  return best;
}

const dividerSets = new WeakMap<TimerSpec, Set<number>>();
function isrDividerSet(t: TimerSpec): Set<number> {
  let s = dividerSets.get(t);
  if (!s) dividerSets.set(t, (s = new Set(t.isrDividers)));
  return s;
}

function choicesForTotal(t: TimerSpec, k: number, highCycles: number, minInterval: number): IsrChoice[] {
  const range = t.counts.isr;
  if (!range) return [];
  const allowed = isrDividerSet(t);
  const divs = divisors(k);
  const out: IsrChoice[] = [];
  for (const interval of divs) {
    const s = k / interval;
    if (interval < minInterval || s < 2 || s > MAX_SOFTWARE_DIVIDER) continue;
    // Smallest legal divider of this interval with the count in range.
    for (const d of divs) {
      if (d > interval / range.min) break;
      if (interval % d !== 0 || !allowed.has(d) || interval / d > range.max) continue;
      const [h, highErr] = bestHighInterrupts(interval, s, highCycles);
      out.push({
        divider: d,
        periodCounts: interval / d,
        softwareDivider: s,
        highCounts: h,
        intervalCycles: interval,
        periodErrorCycles: 0,
        highErrorCycles: highErr,
      });
      break;
    }
  }
  return out;
}

/**
 * @param targetCycles period * clockHz
 * @param highCycles high time * clockHz
 * @param minInterval least interrupt interval in clock cycles
 */
export function bestIsr(
  t: TimerSpec,
  targetCycles: number,
  highCycles: number,
  minInterval: number,
): IsrChoice | null {
  const range = t.counts.isr;
  if (!range) return null;
  const maxInterval = t.isrDividers[t.isrDividers.length - 1] * range.max;
  const lowest = 2 * minInterval;
  const highest = maxInterval * MAX_SOFTWARE_DIVIDER;
  // Out of reach when the nearest total is more than half a cycle away.
  if (targetCycles < lowest - 0.5 || targetCycles > highest + 0.5) return null;
  let down = Math.floor(targetCycles);
  let up = down + 1;
  // A run of totals with no usable factorisation is short in practice; the
  // guard only bounds pathological inputs.
  for (let guard = 0; guard < 200000; guard++) {
    const dDown = down >= lowest ? targetCycles - down : Infinity;
    const dUp = up <= highest ? up - targetCycles : Infinity;
    if (dDown === Infinity && dUp === Infinity) return null;
    const totals: number[] = [];
    if (dDown <= dUp) totals.push(down--);
    if (dUp <= dDown) totals.push(up++);
    let best: IsrChoice | null = null;
    for (const k of totals) {
      for (const c of choicesForTotal(t, k, highCycles, minInterval)) {
        c.periodErrorCycles = Math.abs(k - targetCycles);
        if (!best || betterIsr(c, best)) best = c;
      }
    }
    if (best) return best;
  }
  return null;
}
