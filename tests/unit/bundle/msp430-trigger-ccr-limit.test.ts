// MSP430G2553 triggered firmware: the pulse ends at TACCR0 = delayCounts +
// highCounts, and Timer_A's capture/compare registers are 16 bits wide
// (MSP430x2xx Family User's Guide SLAU144, Timer_A, TACCRx: 16-bit), so the
// sum must be at most 65535 counts. The view refuses anything longer in words
// naming both numbers, on the delay field the user can change.
import { describe, expect, it } from "vitest";
import type { BundlePlan } from "@/lib/bundle";
import { msp430g2553TriggerView } from "@/lib/bundle/trigger-msp430g2553";
import { planTarget } from "@/lib/engine";
import { msp430TriggerRequest } from "./fixtures";
import { expectEngineError } from "../engine/expect-engine-error";

describe("MSP430G2553 triggered TACCR0 limit", () => {
  const plan = planTarget(msp430TriggerRequest()) as BundlePlan;

  it("delay + pulse = 65535 counts fits TACCR0", () => {
    const view = msp430g2553TriggerView({ ...plan, delayCounts: 65535 - plan.highCounts });
    expect(view?.ccr0).toBe(65535);
  });

  it("delay + pulse = 65536 counts is refused on delayS", () => {
    const err = expectEngineError(
      () => msp430g2553TriggerView({ ...plan, delayCounts: 65536 - plan.highCounts }),
      "unreachable-period",
    );
    expect(err.field).toBe("delayS");
    expect(err.message).toBe("msp430g2553: delay plus pulse 65536 counts exceed TACCR0 (65535)");
  });
});
