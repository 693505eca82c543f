// Exact best interrupt plan with a software divider. Totals K = d*n*s clock
// cycles are integers, so the least period error is reached by the integer K
// nearest the target that factors as (interval d*n) * (interrupts s). Totals
// are tried in order of distance from the target; for each, every divisor
// is a candidate interval (>= 500 CPU cycles, common practice: room for the
// handler) with s >= 2 interrupts (one edge each way). Among the totals at
// the least distance: least high-time error, then longest interval, then
// smallest divider (engine.md section 3).
//
// Bounded work per call, by design:
// 1. A bounded subset of (divider, counts) pairs, each with its nearest
//    software divider, gives a plan whose period error e0 bounds the optimum
//    from above (SUBSET_PAIRS pairs, O(1) each). When the subset is every
//    pair (8-bit timers), it is the answer (the exhaustive search).
// 2. Totals are then tried nearest first, but only within e0 of the target:
//    the subset's own total lies there, so the walk ends by then. The walk is
//    also capped at MAX_TOTALS totals; each costs one bounded factorisation
//    (factor.ts) and a divisor pairing of O(divisors x dividers tried).
//    Should the cap ever be reached before e0, the subset's plan is returned
//    (a plan within e0 of the best; the benchmark's adversarial search in
//    scripts/bench/solver-adversarial.ts reports how often: never so far).
import type { TimerSpec } from "../devices/spec";
import { divisors } from "./factor";

export const MAX_SOFTWARE_DIVIDER = 2 ** 32 - 1;
/** (divider, counts) pairs tried in step 1. */
export const SUBSET_PAIRS = 1 << 15;
/** Totals tried in step 2. */
export const MAX_TOTALS = 4096;
/** How often step 2 reached MAX_TOTALS (read by the benchmark). */
export const isrSearchStats = { capped: 0 };

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

function largestPrimeInInterval(t: TimerSpec): number {
  const range = t.counts.isr;
  return Math.max(range ? range.max : 1, t.isrDividers[t.isrDividers.length - 1]);
}

/** Smallest legal divider of this interval with the count in range, or 0. */
function smallestDivider(t: TimerSpec, interval: number, divs: readonly number[]): number {
  const range = t.counts.isr!;
  const lo = Math.ceil(interval / range.max);
  const hi = interval / range.min;
  if (t.isrDividers.length <= 64) {
    // Few dividers (AVR, PIC, MSP430): try each.
    for (const d of t.isrDividers) if (d >= lo && d <= hi && interval % d === 0) return d;
    return 0;
  }
  // Many dividers (every integer up to a limit): walk the divisors from lo.
  const allowed = isrDividerSet(t);
  let i = lowerBound(divs, lo);
  for (; i < divs.length && divs[i] <= hi; i++) {
    const d = divs[i];
    if (interval % d === 0 && allowed.has(d)) return d;
  }
  return 0;
}

function lowerBound(a: readonly number[], x: number): number {
  let lo = 0;
  let hi = a.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (a[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

function choicesForTotal(t: TimerSpec, k: number, highCycles: number, minInterval: number): IsrChoice[] {
  if (!t.counts.isr) return [];
  const divs = divisors(k, largestPrimeInInterval(t));
  const out: IsrChoice[] = [];
  for (const interval of divs) {
    const s = k / interval;
    if (interval < minInterval || s < 2 || s > MAX_SOFTWARE_DIVIDER) continue;
    const d = smallestDivider(t, interval, divs);
    if (!d) continue;
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
  }
  return out;
}

/** Step 1: the best plan among a bounded set of (divider, counts) pairs; complete says it was every pair. */
function subsetBest(
  t: TimerSpec,
  targetCycles: number,
  highCycles: number,
  minInterval: number,
): { best: IsrChoice | null; complete: boolean } {
  const range = t.counts.isr!;
  let budget = SUBSET_PAIRS;
  let best: IsrChoice | null = null;
  for (const d of t.isrDividers) {
    // Counts so short that even the largest software divider falls short are skipped.
    const first = Math.max(
      range.min,
      Math.ceil(minInterval / d),
      Math.floor(targetCycles / (d * MAX_SOFTWARE_DIVIDER)),
    );
    for (let n = first; n <= range.max; n++) {
      if (budget-- <= 0) return { best, complete: false };
      const interval = d * n;
      const x = targetCycles / interval;
      const lo = Math.min(MAX_SOFTWARE_DIVIDER, Math.max(2, Math.floor(x)));
      const hi = Math.min(MAX_SOFTWARE_DIVIDER, Math.max(2, Math.ceil(x)));
      for (const s of lo === hi ? [lo] : [lo, hi]) {
        const err = Math.abs(interval * s - targetCycles);
        if (best && err > best.periodErrorCycles) continue;
        const [h, highErr] = bestHighInterrupts(interval, s, highCycles);
        const c: IsrChoice = {
          divider: d,
          periodCounts: n,
          softwareDivider: s,
          highCounts: h,
          intervalCycles: interval,
          periodErrorCycles: err,
          highErrorCycles: highErr,
        };
        if (!best || betterOrEarlier(c, best)) best = c;
      }
    }
  }
  return { best, complete: true };
}

// The walk below keeps the first of two equal choices, and it meets the
// smaller total first; the subset search must break full ties the same way.
function betterOrEarlier(a: IsrChoice, b: IsrChoice): boolean {
  if (betterIsr(a, b)) return true;
  if (betterIsr(b, a)) return false;
  return a.softwareDivider * a.intervalCycles < b.softwareDivider * b.intervalCycles;
}

/**
 * @param targetCycles period * clockHz
 * @param highCycles high time * clockHz
 * @param minInterval least interrupt interval in clock cycles
 */
// Timers with the same dividers and counts (the RP2040's eight slices) give the
// same answer: the last one is kept so a plan pays for the search once.
let last: { key: unknown[]; choice: IsrChoice | null } | null = null;

/** For the benchmark: make the next call search afresh. */
export function forgetLastIsr(): void {
  last = null;
}

export function bestIsr(
  t: TimerSpec,
  targetCycles: number,
  highCycles: number,
  minInterval: number,
): IsrChoice | null {
  const key = [t.isrDividers, t.counts.isr?.min, t.counts.isr?.max, targetCycles, highCycles, minInterval];
  if (!last || last.key.some((v, i) => v !== key[i]))
    last = { key, choice: searchIsr(t, targetCycles, highCycles, minInterval) };
  return last.choice && { ...last.choice };
}

function searchIsr(
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
  const subset = subsetBest(t, targetCycles, highCycles, minInterval);
  if (subset.complete || !subset.best) return subset.best;
  const bound = subset.best.periodErrorCycles;
  let down = Math.floor(targetCycles);
  let up = down + 1;
  for (let tried = 0; tried < MAX_TOTALS;) {
    const dDown = down >= lowest ? targetCycles - down : Infinity;
    const dUp = up <= highest ? up - targetCycles : Infinity;
    if (Math.min(dDown, dUp) > bound) break;
    const totals: number[] = [];
    if (dDown <= dUp) totals.push(down--);
    if (dUp <= dDown) totals.push(up++);
    tried += totals.length;
    let best: IsrChoice | null = null;
    for (const k of totals) {
      for (const c of choicesForTotal(t, k, highCycles, minInterval)) {
        c.periodErrorCycles = Math.abs(k - targetCycles);
        if (!best || betterIsr(c, best)) best = c;
      }
    }
    if (best) return best;
    if (tried >= MAX_TOTALS) isrSearchStats.capped++;
  }
  return subset.best;
}
