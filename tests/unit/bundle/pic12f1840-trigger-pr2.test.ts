// PIC12F1840 triggered firmware: Timer2 counts the delay, then the pulse, each
// as one PR2 period, so each phase is 1..256 counts (PIC12(L)F1840 datasheet
// DS40001441, Timer2: TMR2 counts from 0 to PR2, an 8-bit register, and
// resets on the match, so one period is PR2 + 1 counts). A phase outside that
// is refused on delayS naming both counts (the product's own message).
import { describe, expect, it } from "vitest";
import type { BundlePlan } from "@/lib/bundle";
import { pic12f1840TriggerView } from "@/lib/bundle/trigger-pic12f1840";
import { planTarget } from "@/lib/engine";
import { expectEngineError } from "../engine/expect-engine-error";

const plan = planTarget({
  device: "pic12f1840",
  clockHz: 4e6,
  periodS: 0.02,
  highS: 1e-3,
  start: "trigger",
  delayS: 4e-3,
}) as BundlePlan;

describe("PIC12F1840 trigger phases in PR2", () => {
  it("256 delay counts (PR2 = 255) are taken", () => {
    expect(plan.highCounts).toBeLessThanOrEqual(256);
    expect(pic12f1840TriggerView({ ...plan, delayCounts: 256 })).not.toBeNull();
  });

  it("257 delay counts are refused on delayS", () => {
    const err = expectEngineError(
      () => pic12f1840TriggerView({ ...plan, delayCounts: 257 }),
      "invalid-request",
    );
    expect(err.field).toBe("delayS");
    expect(err.message).toBe(`pic12f1840: delay 257 / pulse ${plan.highCounts} counts outside PR2's 1..256`);
  });
});
