// IEC 60063 preferred number series. E6, E12 and E24 are written out here
// from the standard's table; E96 spot values and the E48 = every other E96
// rule are from the same table (from memory).
import { describe, expect, it } from "vitest";
import { E_SERIES, nearestStandardValue, standardValuesBetween } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

describe("E-series tables (IEC 60063)", () => {
  it("E6, E12, E24 exactly", () => {
    expect(E_SERIES.E6).toEqual([1.0, 1.5, 2.2, 3.3, 4.7, 6.8]);
    expect(E_SERIES.E12).toEqual([1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2]);
    expect(E_SERIES.E24).toEqual([
      1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8,
      7.5, 8.2, 9.1,
    ]);
  });

  it("E48 and E96 sizes and spot values", () => {
    expect(E_SERIES.E48).toHaveLength(48);
    expect(E_SERIES.E96).toHaveLength(96);
    for (const v of [1.0, 1.02, 1.5, 2.49, 3.01, 4.99, 6.04, 8.06, 9.76]) expect(E_SERIES.E96).toContain(v);
    for (const v of [1.05, 2.15, 4.64, 9.53]) expect(E_SERIES.E48).toContain(v);
    expect(E_SERIES.E48).not.toContain(1.02);
  });

  it("E48 and E96 round the geometric series 10^(i/n) to three digits", () => {
    // Rule of the standard for E48 and above (E192 has one exception, 9.20).
    for (const name of ["E48", "E96"] as const) {
      const n = E_SERIES[name].length;
      E_SERIES[name].forEach((v, i) => expect(v).toBe(Math.round(100 * 10 ** (i / n)) / 100));
    }
  });
});

describe("nearest standard value", () => {
  it("on a log scale, across decades", () => {
    expect(nearestStandardValue(4600, "E12").value).toBe(4700);
    expect(nearestStandardValue(5000, "E24").value).toBe(5100);
    expect(nearestStandardValue(9.9e3, "E12").value).toBe(10e3);
    expect(nearestStandardValue(1.05, "E6").value).toBe(1.0);
    expect(nearestStandardValue(3.3e-9, "E6").value).toBe(3.3e-9);
    expect(nearestStandardValue(47e-6, "E12").value).toBe(47e-6);
    const r = nearestStandardValue(12345, "E96");
    expect(r.value).toBe(12400);
    expect(r.errorRel).toBeCloseTo((12400 - 12345) / 12345, 12);
  });

  it("values between limits", () => {
    expect(standardValuesBetween("E6", 1e3, 10e3)).toEqual([1e3, 1.5e3, 2.2e3, 3.3e3, 4.7e3, 6.8e3, 10e3]);
  });

  it("bounds carrying float error keep the value they stand for: a relative 1e-12 of slack, ends included", () => {
    // A bound worked out as 1 kΩ by arithmetic can land a few ulps off 1000; the documented
    // slack is 1e-12 of the bound, and a value exactly at the slack's end is still inside.
    const high = 1000 / (1 + 1e-12);
    const low = 1000 / (1 - 1e-12);
    expect([high * (1 + 1e-12), low * (1 - 1e-12)]).toEqual([1000, 1000]);
    expect(standardValuesBetween("E6", 100, high)).toEqual([100, 150, 220, 330, 470, 680, 1000]);
    expect(standardValuesBetween("E6", low, 1e4)).toEqual([1000, 1500, 2200, 3300, 4700, 6800, 10000]);
    // Twice the slack is outside.
    expect(standardValuesBetween("E6", 100, 1000 / (1 + 2e-12))).not.toContain(1000);
    expect(standardValuesBetween("E6", 1000 / (1 - 2e-12), 1e4)).not.toContain(1000);
  });

  it("refuses non-positive input", () => {
    expectEngineError(() => nearestStandardValue(0), "invalid-value");
    expectEngineError(() => nearestStandardValue(NaN), "invalid-value");
  });
});
