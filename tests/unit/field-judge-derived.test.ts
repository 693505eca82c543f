// One slip in the period reading fails the period line only; the verdict
// follows the measured quantities (IEEE Std 181-2011: duty = pulse duration /
// period, so frequency and duty are derived). Limits rule: common practice, no source.
import { describe, expect, it } from "vitest";
import type { BundlePlan } from "@/lib/bundle";
import { planTarget } from "@/lib/engine";
import { judgeCheck, requiredRelativeOf } from "@/lib/field/judge";
import { TARGETS } from "./bundle/fixtures";

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
