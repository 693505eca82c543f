// MSP430G2553 clock and timer names in the bundle, checked without mspdebug.
// - LFXT1 in low-frequency mode takes a 32768 Hz watch crystal (MSP430x2xx
//   Family User's Guide SLAU144, Basic Clock Module+, LFXT1S_0 = 32768-Hz
//   crystal); another frequency on that option is refused on clockHz.
// - The triggered firmware runs on Timer0_A3, whose registers SLAU144 and the
//   MSP430G2553 datasheet name TA0CTL, TA0CCRx: the names TIMER0_A3, Timer0_A
//   and TA0 are all that timer.
import { describe, expect, it } from "vitest";
import type { BundlePlan } from "@/lib/bundle";
import { msp430ClockSetup } from "@/lib/bundle/device-msp430g2553";
import { msp430g2553TriggerView } from "@/lib/bundle/trigger-msp430g2553";
import { planTarget } from "@/lib/engine";
import { TARGETS, msp430TriggerRequest } from "./fixtures";
import { expectEngineError } from "../engine/expect-engine-error";

describe("MSP430G2553 LFXT1 watch crystal", () => {
  const plan = planTarget(TARGETS[12]) as BundlePlan;

  it("32768 Hz is set up as LFXT1S_0 with the crystal's load capacitors", () => {
    expect(msp430ClockSetup({ ...plan, clockSource: "lfxt1", clockHz: 32768 })).toMatchObject({
      source: "lfxt1",
      bcsctl3: "LFXT1S_0 | XCAP_3",
    });
  });

  it("32000 Hz on LFXT1 is refused on clockHz", () => {
    const err = expectEngineError(
      () => msp430ClockSetup({ ...plan, clockSource: "lfxt1", clockHz: 32000 }),
      "clock-out-of-range",
    );
    expect(err.field).toBe("clockHz");
    expect(err.message).toBe("msp430g2553: LFXT1 with a watch crystal runs at 32768 Hz, not 32000 Hz");
  });
});

describe("MSP430G2553 triggered firmware timer names", () => {
  const plan = planTarget(msp430TriggerRequest()) as BundlePlan;

  it.each(["TIMER0_A3", "Timer0_A", "TA0"])("%s is Timer0_A3", (timer) => {
    expect(plan.timer).toBe("TIMER0_A3");
    expect(msp430g2553TriggerView({ ...plan, timer })).toEqual(msp430g2553TriggerView(plan));
  });

  it("another timer is refused by name", () => {
    const err = expectEngineError(
      () => msp430g2553TriggerView({ ...plan, timer: "TIMER1_A3" }),
      "invalid-request",
    );
    expect(err.message).toBe("msp430g2553: no triggered firmware for TIMER1_A3");
  });
});
