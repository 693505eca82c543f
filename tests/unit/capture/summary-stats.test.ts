// The interval summary shown with every measurement: mean, sample standard
// deviation with n - 1 in the divisor (NIST/SEMATECH e-Handbook of
// Statistical Methods, 1.3.5.6 "Measures of Scale", from memory), min, max.
import { describe, expect, it } from "vitest";
import { summarize } from "@/lib/capture/stats";

describe("summarize", () => {
  it("2, 4, 4, 4, 5, 5, 7, 9: mean 5, sum of squares 32, s = sqrt(32 / 7)", () => {
    const s = summarize([2, 4, 4, 4, 5, 5, 7, 9]);
    expect(s.mean).toBe(5);
    expect(s.std).toBeCloseTo(Math.sqrt(32 / 7), 12);
    expect(s).toMatchObject({ min: 2, max: 9, count: 8 });
  });

  it("one value has no spread; none gives NaN", () => {
    expect(summarize([3])).toEqual({ mean: 3, std: 0, min: 3, max: 3, count: 1 });
    expect(summarize([]).mean).toBeNaN();
  });
});
