// trimWrites (lib/bundle/trim-control.ts) turns exactly one TOP write and one
// compare write of a fixed firmware into expressions of the calibration
// constant TRIM_PERIOD_COUNTS; a register view without that one pair is
// refused with the product's own message naming device and timer. TOP is
// periodCounts - 1 in ICR1 for ATmega328P Timer1 fast PWM mode 14 (ATmega328P
// datasheet, 16-bit Timer/Counter1, Fast PWM: TOP = ICR1).
import { describe, expect, it } from "vitest";
import { planTarget } from "@/lib/engine";
import { DEVICES } from "@/lib/bundle/devices";
import { trimWrites } from "@/lib/bundle/trim-control";
import { TARGETS } from "./fixtures";

const REFUSAL = "atmega328p TIMER1: no single TOP and compare write to take the trimmer's constant.";

describe("trimWrites: one TOP and one compare write take the constant", () => {
  it("the ATmega328P Timer1 PWM view: ICR1 becomes TRIM_PERIOD_COUNTS - 1", () => {
    const plan = planTarget(TARGETS[0]);
    expect(plan.timer).toBe("TIMER1");
    const out = trimWrites(plan, DEVICES.atmega328p.view(plan).writes);
    expect(out.find((w) => w.reg === "ICR1")?.expr).toBe("(TRIM_PERIOD_COUNTS - 1u)");
  });

  it("a view with no TOP or compare write is refused with the message naming device and timer", () => {
    const plan = planTarget(TARGETS[0]);
    expect(() => trimWrites(plan, [])).toThrow(REFUSAL);
  });

  it("a view whose TOP write appears twice is refused the same way", () => {
    const plan = planTarget(TARGETS[0]);
    const writes = DEVICES.atmega328p.view(plan).writes;
    const icr1 = writes.find((w) => w.reg === "ICR1")!;
    expect(() => trimWrites(plan, [...writes, icr1])).toThrow(REFUSAL);
  });
});
