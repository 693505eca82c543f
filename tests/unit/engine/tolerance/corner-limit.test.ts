// The corner analysis's size limit, engine.md "Tolerance": every min/max
// combination, 2^n corners for n <= 12 toleranced parameters. Twelve is
// inside the limit; the thirteenth is refused with the product's own message.
import { describe, expect, it } from "vitest";
import { cornerSpread } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

/** n parameters p0..p(n-1), each 1 with a 10 % tolerance. */
function params(n: number) {
  const nominal: Record<string, number> = {};
  const tolerances: Record<string, number> = {};
  for (let i = 0; i < n; i++) {
    nominal[`p${i}`] = 1;
    tolerances[`p${i}`] = 0.1;
  }
  return { nominal, tolerances };
}

/** Period = the sum of the parameters: its corners are n * 0.9 and n * 1.1. */
const sum = (p: Record<string, number>) => {
  const periodS = Object.values(p).reduce((a, b) => a + b, 0);
  return { periodS, highS: periodS / 2 };
};

describe("corner analysis limit (engine.md: 2^n corners, n <= 12)", () => {
  it("evaluates all 2^12 = 4096 corners of 12 toleranced parameters", () => {
    const { nominal, tolerances } = params(12);
    const r = cornerSpread(nominal, tolerances, sum);
    expect(r.count).toBe(4096);
    expect(r.failed).toBe(0);
    expect(r.periodS.min).toBeCloseTo(12 * 0.9, 12);
    expect(r.periodS.max).toBeCloseTo(12 * 1.1, 12);
  });

  it("refuses 13 toleranced parameters, naming the limit", () => {
    const { nominal, tolerances } = params(13);
    const e = expectEngineError(() => cornerSpread(nominal, tolerances, sum), "invalid-stage");
    expect(e.field).toBe("tolerances");
    expect(e.message).toBe("At most 12 toleranced parameters.");
  });
});
