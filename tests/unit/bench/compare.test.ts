// Bookkeeping of the fast-solver vs brute-force comparison. The checks are
// the definitions themselves: same error = equal error fields (or both
// solvers found nothing); share = same / compared; ratio = brute / fast time.
import { describe, expect, it } from "vitest";
import { seededRandom } from "@/lib/engine";
import { DEVICES } from "@/lib/engine/devices";
import type { HardwareChoice, IsrChoice } from "@/lib/engine/solver";
import {
  pairCount,
  referenceSpace,
  sameHardwareError,
  sameIsrError,
  sampleAscending,
  tally,
} from "@/scripts/bench/compare";

const hw = (errorQuanta: number, divider = 8, periodCounts = 100): HardwareChoice => ({
  divider,
  periodCounts,
  modeFactor: 1,
  errorQuanta,
  inRange: true,
});
const isr = (periodErrorCycles: number, highErrorCycles: number, divider = 1): IsrChoice => ({
  divider,
  periodCounts: 250,
  softwareDivider: 4,
  highCounts: 1,
  intervalCycles: 250 * divider,
  periodErrorCycles,
  highErrorCycles,
});
const timer = (device: string, name: string) =>
  DEVICES.find((d) => d.id === device)!.timers.find((t) => t.name === name)!;

describe("same error", () => {
  it("compares the error, not the setting that reaches it", () => {
    expect(sameHardwareError(hw(3, 8, 100), hw(3, 64, 12))).toBe(true);
    expect(sameHardwareError(hw(3), hw(2))).toBe(false);
    expect(sameIsrError(isr(0, 5, 1), isr(0, 5, 8))).toBe(true);
    expect(sameIsrError(isr(0, 5), isr(0, 6))).toBe(false);
    expect(sameIsrError(isr(1, 5), isr(0, 5))).toBe(false);
  });

  it("counts 'both found nothing' as agreement and 'one found nothing' as a mismatch", () => {
    expect(sameHardwareError(null, null)).toBe(true);
    expect(sameHardwareError(hw(0), null)).toBe(false);
    expect(sameIsrError(null, isr(0, 0))).toBe(false);
  });
});

describe("tally", () => {
  it("adds times, share and ratio, and lists the mismatches", () => {
    const t = tally([
      { label: "a", same: true, fastMs: 0.5, bruteMs: 100 },
      { label: "b", same: false, fastMs: 0.25, bruteMs: 50 },
      { label: "c", same: true, fastMs: 0.25, bruteMs: 150 },
      { label: "d", same: true, fastMs: 0, bruteMs: 0 },
    ]);
    expect(t).toEqual({
      compared: 4,
      same: 3,
      sharePct: 75,
      fastMs: 1,
      bruteMs: 300,
      ratio: 300,
      mismatches: ["b"],
    });
  });

  it("has no share or ratio for an empty batch", () => {
    const t = tally([]);
    expect(t.sharePct).toBeNaN();
    expect(t.ratio).toBeNaN();
  });
});

describe("reduced search spaces", () => {
  it("samples keep both ends, stay ascending, distinct and inside the list", () => {
    const values = Array.from({ length: 1000 }, (_, i) => (i + 16) / 16);
    const s = sampleAscending(values, 9, seededRandom(3));
    expect(s).toHaveLength(9);
    expect(s[0]).toBe(values[0]);
    expect(s[8]).toBe(values[999]);
    for (let i = 1; i < s.length; i++) expect(s[i]).toBeGreaterThan(s[i - 1]);
    for (const v of s) expect(values).toContain(v);
    expect(sampleAscending([1, 2, 3], 9, seededRandom(3))).toEqual([1, 2, 3]);
  });

  it("counts pairs as dividers x counter values x mode factors", () => {
    // ATmega328P Timer1: prescalers 1, 8, 64, 256, 1024 (datasheet, TCCR1B CS12:0); TOP+1 = 4..65536 in fast PWM 14.
    const t1 = timer("atmega328p", "TIMER1");
    expect(pairCount(t1, "pwm")).toBe(5 * (65536 - 4 + 1));
    expect(pairCount(timer("pic12f1840", "TIMER2"), "toggle")).toBe(0);
  });

  it("keeps a small timer whole and cuts a large one to the pair budget", () => {
    const budget = { hardware: 600_000, isr: 200_000 };
    const small = referenceSpace(timer("attiny85", "TIMER0"), budget, seededRandom(1));
    expect(small.full).toBe(true);
    expect(small.timer).toBe(timer("attiny85", "TIMER0"));

    const tim2 = timer("stm32g031", "TIM2");
    const big = referenceSpace(tim2, budget, seededRandom(1));
    expect(big.full).toBe(false);
    expect(big.timer.counts.pwm).toEqual({ min: 2, max: 65536 });
    for (const m of ["pwm", "toggle"] as const)
      expect(pairCount(big.timer, m)).toBeLessThanOrEqual(budget.hardware);
    expect(pairCount(big.timer, "isr")).toBeLessThanOrEqual(budget.isr);
    expect(big.timer.dividers[0]).toBe(1);
    expect(big.timer.dividers.at(-1)).toBe(65536);
    expect(tim2.counts.pwm!.max).toBe(2 ** 32); // the original is untouched
  });
});
