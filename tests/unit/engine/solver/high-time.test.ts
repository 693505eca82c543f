// nearestHighCounts against an exhaustive search of its own. engine.md
// section 3: "High time: nearest legal compare value to H*". Legal values are
// the multiples of the step (1 count; 0.25 for the PIC12F1840's 10-bit duty,
// PIC12F1840 datasheet DS41419, CCP PWM duty cycle: DC1B<1:0> below CCPR1L)
// from one step to one step short of the period, so the output still has a
// high and a low part (the function's own contract). An exact tie goes to
// the shorter high time (the engine's rule; engine.md asks only for nearest).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { nearestHighCounts } from "@/lib/engine/solver/high-time";

/** Every legal value, scanned: no floor, ceil or clamp shared with the code. */
function exhaustive(h: number, n: number, step: number): number {
  let best = NaN;
  let bestErr = Infinity;
  for (let k = 1; k * step <= n - step + 1e-12; k++) {
    const v = k * step;
    const err = Math.abs(v - h);
    // strict: the first (shorter) of two equally near values stays
    if (err < bestErr) {
      best = v;
      bestErr = err;
    }
  }
  return best;
}

describe("nearestHighCounts (engine.md section 3: nearest legal compare value)", () => {
  it("rounds to the nearest count, not down: 2.6 -> 3, 2.4 -> 2", () => {
    expect(nearestHighCounts(2.6, 100, 1)).toBe(3);
    expect(nearestHighCounts(2.4, 100, 1)).toBe(2);
    expect(nearestHighCounts(97.9, 100, 1)).toBe(98);
  });

  it("an exact half goes to the shorter high time", () => {
    expect(nearestHighCounts(2.5, 100, 1)).toBe(2);
    expect(nearestHighCounts(2.125, 100, 0.25)).toBe(2);
  });

  it("keeps one step of high and one of low at the ends", () => {
    expect(nearestHighCounts(0, 100, 1)).toBe(1);
    expect(nearestHighCounts(0.2, 100, 1)).toBe(1);
    expect(nearestHighCounts(-5, 100, 1)).toBe(1);
    expect(nearestHighCounts(100, 100, 1)).toBe(99);
    expect(nearestHighCounts(99.7, 100, 1)).toBe(99);
    expect(nearestHighCounts(1e9, 100, 1)).toBe(99);
    // PIC quarter counts: 0.25 .. N - 0.25
    expect(nearestHighCounts(0, 10, 0.25)).toBe(0.25);
    expect(nearestHighCounts(10, 10, 0.25)).toBe(9.75);
  });

  it("PIC quarter counts: nearest multiple of 0.25", () => {
    expect(nearestHighCounts(3.3, 50, 0.25)).toBe(3.25);
    expect(nearestHighCounts(3.4, 50, 0.25)).toBe(3.5);
    expect(nearestHighCounts(3.1, 50, 0.25)).toBe(3);
  });

  it("equals the exhaustive scan over every legal value (sampled counts, both steps)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 3, max: 300 }),
        fc.constantFrom(1, 0.25),
        // high time from below the range to past it; every other draw on the
        // half-step grid, where ties between two legal values happen
        fc.integer({ min: -40, max: 1240 }),
        fc.boolean(),
        (n, step, q, grid) => {
          const raw = (q / 1200) * (n + 2 * step) - step;
          const h = grid ? Math.round(raw / (step / 2)) * (step / 2) : raw;
          expect(nearestHighCounts(h, n, step), `h ${h} n ${n} step ${step}`).toBe(exhaustive(h, n, step));
        },
      ),
      { numRuns: 3000, seed: 9301 },
    );
  });
});
