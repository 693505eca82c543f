import { describe, expect, it } from "vitest";
import { quantile } from "@/lib/engine/tolerance";

describe("quantile of no data", () => {
  it("is NaN, not a read past the array", () => {
    // Hyndman & Fan (1996), sample quantiles: defined from order statistics, so none exist for n = 0.
    expect(Number.isNaN(quantile([], 0))).toBe(true);
    expect(Number.isNaN(quantile(new Float64Array(0), 0.5))).toBe(true);
  });
});
