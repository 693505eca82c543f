// Percentiles by the linear-interpolation rule of Hyndman & Fan (1996),
// definition 7 (the default of R's quantile() and NumPy's percentile()).
import { describe, expect, it } from "vitest";
import { median, percentile } from "@/scripts/bench/stats";

describe("percentile", () => {
  it("interpolates between closest ranks on 1..10", () => {
    // Definition 7: h = (n - 1) p = 9 p on the sorted values 1..10 (x at rank h is 1 + h):
    // p = .5 -> 5.5, .95 -> 9.55, .99 -> 9.91, .25 -> 3.25
    const xs = [7, 3, 10, 1, 9, 2, 8, 4, 6, 5];
    expect(percentile(xs, 50)).toBeCloseTo(5.5, 12);
    expect(percentile(xs, 95)).toBeCloseTo(9.55, 12);
    expect(percentile(xs, 99)).toBeCloseTo(9.91, 12);
    expect(percentile(xs, 25)).toBeCloseTo(3.25, 12);
  });

  it("gives the extremes at 0 and 100 and the middle value of an odd count", () => {
    const xs = [4, 1, 3, 2, 5];
    expect(percentile(xs, 0)).toBe(1);
    expect(percentile(xs, 100)).toBe(5);
    expect(median(xs)).toBe(3);
    expect(median([2, 1])).toBe(1.5);
  });

  it("does not reorder its input, gives NaN for no samples and rejects p outside 0..100", () => {
    const xs = [3, 1, 2];
    percentile(xs, 50);
    expect(xs).toEqual([3, 1, 2]);
    expect(percentile([], 50)).toBeNaN();
    expect(() => percentile(xs, 101)).toThrow(RangeError);
    expect(() => percentile(xs, NaN)).toThrow(RangeError);
  });
});
