// Bookkeeping for the fast-solver vs brute-force comparison: what counts as
// "the same error", the tally of a batch, and the reduced search spaces used
// where enumerating every (divider, counter) pair would take hours.
import type { TimerSpec } from "@/lib/engine/devices";
import type { HardwareChoice, IsrChoice } from "@/lib/engine/solver";

/** Both found nothing, or both reach exactly the same period error. */
export function sameHardwareError(a: HardwareChoice | null, b: HardwareChoice | null): boolean {
  if (!a || !b) return a === b;
  return a.errorQuanta === b.errorQuanta;
}

/** Both found nothing, or both reach the same period and high-time errors. */
export function sameIsrError(a: IsrChoice | null, b: IsrChoice | null): boolean {
  if (!a || !b) return a === b;
  return a.periodErrorCycles === b.periodErrorCycles && a.highErrorCycles === b.highErrorCycles;
}

export interface ComparisonRow {
  label: string;
  same: boolean;
  fastMs: number;
  bruteMs: number;
}

export interface Tally {
  compared: number;
  same: number;
  /** Share of comparisons with the same error, percent. */
  sharePct: number;
  fastMs: number;
  bruteMs: number;
  /** Brute-force time over fast-solver time on the same problems. */
  ratio: number;
  mismatches: string[];
}

export function tally(rows: readonly ComparisonRow[]): Tally {
  const same = rows.filter((r) => r.same).length;
  const fastMs = rows.reduce((s, r) => s + r.fastMs, 0);
  const bruteMs = rows.reduce((s, r) => s + r.bruteMs, 0);
  return {
    compared: rows.length,
    same,
    sharePct: rows.length ? (100 * same) / rows.length : NaN,
    fastMs,
    bruteMs,
    ratio: fastMs > 0 ? bruteMs / fastMs : NaN,
    mismatches: rows.filter((r) => !r.same).map((r) => r.label),
  };
}

/** k values of an ascending list: the first, the last and k - 2 others picked by `rand`, ascending. */
export function sampleAscending(values: readonly number[], k: number, rand: () => number): number[] {
  if (values.length <= k) return [...values];
  const picked = new Set<number>([0, values.length - 1]);
  while (picked.size < k) picked.add(1 + Math.floor(rand() * (values.length - 2)));
  return [...picked].sort((a, b) => a - b).map((i) => values[i]);
}

/** Pairs a brute-force run over this timer enumerates in a mode. */
export function pairCount(t: TimerSpec, mode: "pwm" | "toggle" | "isr"): number {
  const range = t.counts[mode];
  if (!range) return 0;
  if (mode === "isr") return t.isrDividers.length * (range.max - range.min + 1);
  return t.dividers.length * (range.max - range.min + 1) * (t.modeFactors[mode]?.length ?? 0);
}

/**
 * The timer itself when a brute-force run stays under `maxPairs` per mode;
 * otherwise a copy with sampled dividers and the counter range cut to 2^16
 * (both solvers then search the same reduced space). `full` says which.
 */
export function referenceSpace(
  t: TimerSpec,
  maxPairs: { hardware: number; isr: number },
  rand: () => number,
): { timer: TimerSpec; full: boolean } {
  const modes = ["pwm", "toggle", "isr"] as const;
  const fits = modes.every((m) => pairCount(t, m) <= (m === "isr" ? maxPairs.isr : maxPairs.hardware));
  if (fits) return { timer: t, full: true };
  const counts: TimerSpec["counts"] = {};
  for (const m of modes) {
    const r = t.counts[m];
    if (r) counts[m] = { min: r.min, max: Math.min(r.max, 2 ** 16) };
  }
  const maxCounts = Math.max(...Object.values(counts).map((r) => r!.max));
  const factors = Math.max(1, ...Object.values(t.modeFactors).map((f) => f!.length));
  const k = (budget: number, per: number) => Math.max(2, Math.floor(budget / per));
  return {
    timer: {
      ...t,
      counts,
      dividers: sampleAscending(t.dividers, k(maxPairs.hardware, maxCounts * factors), rand),
      isrDividers: sampleAscending(t.isrDividers, k(maxPairs.isr, maxCounts), rand),
    },
    full: false,
  };
}
