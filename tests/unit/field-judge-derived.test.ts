// One slip in the period reading fails the period line only; the verdict
// follows the measured quantities (IEEE Std 181-2011: duty = pulse duration /
// period, so frequency and duty are derived). Limits rule: common practice, no source.
import { describe, expect, it } from "vitest";
import type { BundlePlan } from "@/lib/bundle";
import { planTarget } from "@/lib/engine";
import { judgeCheck, requiredRelativeOf } from "@/lib/field/judge";
import { TARGETS } from "./bundle/fixtures";
import { defaultResolutionS } from "@/components/field/reading-step";

describe("field-check verdict", () => {
  const plan = planTarget(TARGETS[0]) as BundlePlan;

  it("a cursor reading 1.5 % off passes against a 2 % requirement", () => {
    const v = judgeCheck(plan, null, { periodS: plan.periodS * 1.015, highS: plan.highS }, 0, 0.02);
    expect(v.passed).toBe(true);
  });

  it("the same reading fails without the requirement, on the period line", () => {
    const v = judgeCheck(plan, null, { periodS: plan.periodS * 1.015, highS: plan.highS }, 0);
    expect(v.passed).toBe(false);
    const failed = v.lines.filter((l) => !l.pass && !l.derived).map((l) => l.id);
    expect(failed).toEqual(["period"]);
  });

  it("reads the required tolerance from the stored budget", () => {
    expect(requiredRelativeOf([{ budget: { requiredPpm: 20000 } }], 0)).toBeCloseTo(0.02, 12);
    expect(requiredRelativeOf([{ budget: null }], 0)).toBeUndefined();
  });
});

// The stated instrument resolution widens each limit by exactly its value
// (issue 18 point 1; rule: common practice, no source).
describe("instrument resolution in the verdict", () => {
  const plan = planTarget(TARGETS[0]) as BundlePlan;
  const bare = judgeCheck(plan, null, { periodS: plan.periodS, highS: plan.highS }, 0);
  const edge = bare.lines.find((l) => l.id === "period")!.max;

  it("a reading 5 us past the bare limit fails without and passes with a 10 us resolution", () => {
    const reading = { periodS: edge + 5e-6, highS: plan.highS };
    expect(judgeCheck(plan, null, reading, 0).passed).toBe(false);
    const v = judgeCheck(plan, null, { ...reading, resolutionS: 10e-6 }, 0);
    expect(v.passed).toBe(true);
    expect(v.lines.find((l) => l.id === "period")!.source).toContain("instrument resolution 10.0 µs");
  });

  it("15 us past the limit still fails with a 10 us resolution", () => {
    const v = judgeCheck(plan, null, { periodS: edge + 15e-6, highS: plan.highS, resolutionS: 10e-6 }, 0);
    expect(v.passed).toBe(false);
  });
});

describe("default instrument resolution", () => {
  // One step in the third significant digit (common practice, no source).
  it("is 10 us for a 6.16 ms period and 1 ms for 100 ms", () => {
    expect(defaultResolutionS(6.16e-3)).toBeCloseTo(10e-6, 15);
    expect(defaultResolutionS(0.1)).toBeCloseTo(1e-3, 15);
    expect(defaultResolutionS(16.7e-6)).toBeCloseTo(0.1e-6, 18);
    expect(defaultResolutionS(0)).toBe(0);
  });
});
