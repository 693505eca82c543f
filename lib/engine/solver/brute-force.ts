// Reference solvers that try every legal pair, for the tests and the
// benchmark. They share only the ordering rules with the fast solvers.
import type { TimerSpec } from "../devices/spec";
import { betterHardware, type HardwareChoice } from "./hardware";
import { bestHighInterrupts, betterIsr, MAX_SOFTWARE_DIVIDER, type IsrChoice } from "./isr";

/** Best (divider, counts, mode factor) by trying every divider and every counter value. */
export function bruteForceBestPeriod(
  timer: TimerSpec,
  mode: "pwm" | "toggle",
  clockHz: number,
  periodS: number,
): HardwareChoice | null {
  const range = timer.counts[mode];
  const factors = timer.modeFactors[mode];
  if (!range || !factors) return null;
  const q = timer.dividerQuantum;
  const target = periodS * clockHz * q;
  let best: HardwareChoice | null = null;
  for (const m of factors)
    for (const d of timer.dividers) {
      const step = Math.round(d * q) * m;
      for (let n = range.min; n <= range.max; n++) {
        const c: HardwareChoice = {
          divider: d,
          periodCounts: n,
          modeFactor: m,
          errorQuanta: Math.abs(step * n - target),
          inRange: true,
        };
        if (!best || betterHardware(c, best)) best = c;
      }
    }
  return best;
}

/** Best interrupt plan by trying every divider and counter value, with the nearest software divider. */
export function bruteForceBestIsr(
  timer: TimerSpec,
  clockHz: number,
  periodS: number,
  highS: number,
  minInterval: number,
): IsrChoice | null {
  const range = timer.counts.isr;
  if (!range) return null;
  const target = periodS * clockHz;
  const high = highS * clockHz;
  let best: IsrChoice | null = null;
  for (const d of timer.isrDividers)
    for (let n = range.min; n <= range.max; n++) {
      const interval = d * n;
      if (interval < minInterval) continue;
      const x = target / interval;
      for (const s of new Set([Math.floor(x), Math.ceil(x), 2])) {
        if (s < 2 || s > MAX_SOFTWARE_DIVIDER) continue;
        const [h, highErr] = bestHighInterrupts(interval, s, high);
        const c: IsrChoice = {
          divider: d,
          periodCounts: n,
          softwareDivider: s,
          highCounts: h,
          intervalCycles: interval,
          periodErrorCycles: Math.abs(interval * s - target),
          highErrorCycles: highErr,
        };
        if (!best || betterIsr(c, best)) best = c;
      }
    }
  return best;
}
