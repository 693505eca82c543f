// Bounded solver work (issue 15 point 1): the interrupt search and the
// factorisation it rests on stay exact while their work is capped, and
// periods beyond what any device can count are refused with a clear message.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  analyzeStage,
  isEngineError,
  LONGEST_PERIOD_S,
  longestPeriodS,
  planTarget,
  type Stage,
} from "@/lib/engine";
import { DEVICES } from "@/lib/engine/devices";
import { bestIsr, bruteForceBestIsr, minIsrIntervalCycles } from "@/lib/engine/solver";
import { divisors, isPrime, splitComposite } from "@/lib/engine/solver/factor";

const device = (id: string) => DEVICES.find((d) => d.id === id)!;
const timer = (id: string, name: string) => device(id).timers.find((t) => t.name === name)!;

function naiveDivisors(k: number): number[] {
  const out: number[] = [];
  for (let d = 1; d <= k; d++) if (k % d === 0) out.push(d);
  return out;
}

describe("factorisation", () => {
  it("lists every divisor (checked by dividing by every integer up to k)", () => {
    // Arithmetic: d divides k iff k mod d = 0.
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 200_000 }), (k) => {
        expect(divisors(k)).toEqual(naiveDivisors(k));
      }),
      { numRuns: 40, seed: 15 },
    );
  });

  it("splits products of two primes above 2^16, as 32-bit counts need", () => {
    // 65537 is the Fermat prime F4; 1073741827 and 8388593, 8388587 are primes
    // (checked here with trial division by every odd number up to the root).
    const trialPrime = (n: number) => {
      for (let d = 3; d * d <= n; d += 2) if (n % d === 0) return false;
      return n % 2 === 1;
    };
    for (const p of [65537, 1073741827, 8388593, 8388587]) expect(trialPrime(p)).toBe(true);
    for (const p of [65537, 1073741827, 8388593, 8388587]) expect(isPrime(p)).toBe(true);
    expect(isPrime(65537 * 65539)).toBe(false);
    const n = 8388593 * 8388587;
    expect([n / splitComposite(n), splitComposite(n)].sort((a, b) => a - b)).toEqual([8388587, 8388593]);
    expect(divisors(2 * n)).toEqual([1, 2, 8388587, 8388593, 2 * 8388587, 2 * 8388593, n, 2 * n]);
  });

  it("leaves out primes no interval can contain", () => {
    // 2^4 x 65537: with intervals made of primes <= 2^16, 65537 goes to the software divider.
    expect(divisors(16 * 65537, 65536)).toEqual([1, 2, 4, 8, 16]);
  });
});

describe("interrupt search on long periods equals exhaustive enumeration", () => {
  // The 16-bit ATmega328P TIMER1 has more (divider, count) pairs than the
  // bounded first step tries, so these exercise the bounded walk. The issue's
  // case: a 555 with very large resistors, period about 3.5e6 s, at 20 MHz.
  const t = timer("atmega328p", "TIMER1");
  const hz = 20e6;
  const minInterval = minIsrIntervalCycles(device("atmega328p"));
  // The last two are a prime total plus a quarter cycle whose neighbours do not
  // factor either: the walk must go several totals out (found by search).
  const periods = [
    3.5e6,
    1234567.891,
    3517.2,
    86400.5,
    7.77e5,
    40.000001,
    (137438954581 + 0.25) / hz,
    (137438964973 + 0.25) / hz,
  ];
  for (const p of periods)
    it(`${p} s`, () => {
      const h = p * 0.4;
      const fast = bestIsr(t, p * hz, h * hz, minInterval)!;
      const slow = bruteForceBestIsr(t, hz, p, h, minInterval)!;
      expect(fast.periodErrorCycles).toBe(slow.periodErrorCycles);
      expect(fast.highErrorCycles).toBe(slow.highErrorCycles);
      expect([fast.intervalCycles, fast.divider]).toEqual([slow.intervalCycles, slow.divider]);
    });
});

describe("longest representable period", () => {
  it("is the exact-count limit at the slowest clock for every device", () => {
    // Every device's largest divider x count x 32-bit software divider
    // exceeds 2^46 cycles, so the solver's exact-count limit sets the bound.
    for (const d of DEVICES) expect(longestPeriodS(d)).toBe(2 ** 46 / d.minClockHz);
    expect(LONGEST_PERIOD_S).toBe(Math.max(...DEVICES.map((d) => 2 ** 46 / d.minClockHz)));
  });

  it("refuses a longer period naming the field and the reach at this clock", () => {
    let err: unknown;
    try {
      planTarget({ device: "atmega328p", clockHz: 20e6, periodS: 4e6, highS: 1e6, mode: "isr" });
    } catch (e) {
      err = e;
    }
    expect(isEngineError(err)).toBe(true);
    const e = err as { code: string; field?: string; message: string };
    expect([e.code, e.field]).toEqual(["unreachable-period", "periodS"]);
    expect(e.message).toContain("(3518000 s at this clock)");
  });

  it("gives a modelled stage beyond every target an error check", () => {
    // TI NE555 data sheet, astable: f = 1.44 / ((RA + 2 RB) C): 1 TΩ and 100 F give about 2e14 s.
    const a = analyzeStage({ kind: "timer555-astable", supplyV: 12, ra: 1e12, rb: 1e12, c: 100 } as Stage);
    expect(a.periodS).toBeGreaterThan(LONGEST_PERIOD_S);
    expect(a.checks.map((c) => [c.level, c.code])).toContainEqual(["error", "period-beyond-targets"]);
    const ok = analyzeStage({ kind: "timer555-astable", supplyV: 12, ra: 1e4, rb: 1e4, c: 1e-6 } as Stage);
    expect(ok.checks.map((c) => c.code)).not.toContain("period-beyond-targets");
  });
});
