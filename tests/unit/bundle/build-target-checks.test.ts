// Two checks buildBundleSources makes per target, asserted on what reaches
// the bundle and the user.
// 1. The required tolerance (requiredTolerancePct) becomes the checklist's
//    period limit only when it is a positive number; anything else (a stored
//    spec carrying text, zero) leaves the plan as the limit's source. The rule
//    is ours (common practice, no source); the limits themselves are checked
//    in limits.test.ts.
// 2. A kept rate pot's firmware drives its table plan's timer and pin, so a
//    target planned otherwise is refused naming the target by its number and
//    the field of that target (the engine error shape the API answers with).
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleTargetRequest } from "@/lib/bundle";
import { GOLDEN_CASES } from "../../golden/cases";
import { TARGETS, spec } from "./fixtures";
import { expectEngineError } from "../engine/expect-engine-error";

const checklist = (t: BundleTargetRequest) =>
  String(buildBundleSources(spec([t])).find((f) => f.path === "atmega328p/CHECKLIST.md")!.content);
const PLAN_SOURCE = "limit from: plan: clock ±50 ppm + jitter + one timer count";

describe("required tolerance reaches the checklist only as a positive number", () => {
  it("2 % is the period limit's source", () => {
    const list = checklist({ ...TARGETS[0], requiredTolerancePct: 2 });
    expect(list).toContain("limit from: required tolerance ±2 %");
    expect(list).not.toContain(PLAN_SOURCE);
  });

  it.each([
    ["text", "2"],
    ["zero", 0],
    ["a negative number", -2],
  ])("%s leaves the plan as the source", (_, pct) => {
    const list = checklist({ ...TARGETS[0], requiredTolerancePct: pct as never });
    expect(list).toContain(PLAN_SOURCE);
    expect(list).not.toContain("limit from: required tolerance");
  });
});

describe("a target that does not run the kept rate pot's timer and pin", () => {
  const kept = GOLDEN_CASES.find((c) => c.name === "kept-pot-555")!.spec;

  it("is refused naming its number, device, the pot's timer and pin, on its own field", () => {
    // second target: ATtiny85 planned as an interrupt instead of the pot's PWM on TIMER0/PB1
    const targets = [kept.targets[0], { ...kept.targets[1], mode: "isr" as const }];
    expect(kept.targets[1].device).toBe("attiny85");
    const err = expectEngineError(() => buildBundleSources({ ...kept, targets }), "invalid-request");
    expect(err.field).toBe("targets.1");
    expect(err.message).toBe(
      "target 2 (attiny85): the kept rate pot runs TIMER0 in PWM on PB1; plan this target as pwm on TIMER0.",
    );
  });
});
