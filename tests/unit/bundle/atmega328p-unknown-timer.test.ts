// ATmega328P timers: Timer/Counter0, Timer/Counter1 and Timer/Counter2 only
// (ATmega328P datasheet DS40002061, Timer/Counter chapters); a plan naming
// another is refused as an unknown timer naming the device and the timer
// (the product's own message).
import { describe, expect, it } from "vitest";
import type { BundlePlan } from "@/lib/bundle";
import { atmega328pView } from "@/lib/bundle/device-atmega328p";
import { planTarget } from "@/lib/engine";
import { TARGETS } from "./fixtures";
import { expectEngineError } from "../engine/expect-engine-error";

describe("ATmega328P timer names", () => {
  const plan = planTarget(TARGETS[0]) as BundlePlan;

  it("TIMER3 is refused, naming it", () => {
    const err = expectEngineError(() => atmega328pView({ ...plan, timer: "TIMER3" }), "unknown-timer");
    expect(err.message).toBe("atmega328p: no timer TIMER3");
  });
});
