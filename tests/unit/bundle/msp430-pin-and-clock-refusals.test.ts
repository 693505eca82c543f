// MSP430G2553 refusals on pins and clocks the generated code cannot serve, each with its text.
// - SLAS735 (MSP430G2x53 datasheet), pin functions: TA0.1 comes out on P1.2, P1.6 and P2.6;
//   P2.6 and P2.7 are XIN and XOUT, so with LFXT1 (ACLK, TASSEL_1) running they carry the
//   crystal and cannot drive an output. P2.5 is not a TA0.1 pin at all.
// - The triggered firmware's stated latency is counted in CPU cycles at the timer's clock, so it
//   needs MCLK and SMCLK from one DCO (SLAU144, Basic Clock Module+).
// - The triggered code drives and reads port 1 only: P1.0 .. P1.7 by name, output and input apart.
import { describe, expect, it } from "vitest";
import type { BundlePlan } from "@/lib/bundle";
import { msp430g2553View } from "@/lib/bundle/device-msp430g2553";
import { msp430g2553TriggerView } from "@/lib/bundle/trigger-msp430g2553";
import { planTarget } from "@/lib/engine";
import { msp430TriggerRequest } from "./fixtures";
import { expectEngineError } from "../engine/expect-engine-error";

// 32768 Hz watch crystal, 0.5 s period: TACCR0 = 16383 (SLAU144 up mode: period = TACCR0 + 1 counts).
const crystalPlan = () =>
  planTarget({
    device: "msp430g2553",
    clockSource: "lfxt1",
    clockHz: 32768,
    periodS: 0.5,
    highS: 0.125,
    mode: "pwm",
  }) as BundlePlan;
const onPort = (plan: BundlePlan, port: string): BundlePlan => ({ ...plan, pin: { ...plan.pin, port } });

describe("MSP430G2553 output pin with LFXT1 on XIN/XOUT", () => {
  it("P2.6 and P2.7 are refused while the crystal runs, in words naming the pin", () => {
    const plan = crystalPlan();
    expect([plan.clockSource, plan.registers.TACCR0]).toEqual(["lfxt1", 16383]);
    for (const port of ["P2.6", "P2.7"]) {
      const err = expectEngineError(() => msp430g2553View(onPort(plan, port)), "invalid-request");
      expect(err.message).toBe(
        `msp430g2553: the bundle has no code for ${port} as output while it carries XIN/XOUT (timer TIMER0_A3, mode pwm)`,
      );
    }
  });

  it("P2.5 is refused as no TA0.1 pin, not as a crystal pin; P1.6 is taken", () => {
    const plan = crystalPlan();
    const err = expectEngineError(() => msp430g2553View(onPort(plan, "P2.5")), "invalid-request");
    expect(err.message).toBe(
      "msp430g2553: the bundle has no code for TA0.1 on P2.5 (timer TIMER0_A3, mode pwm)",
    );
    expect(msp430g2553View(onPort(plan, "P1.6")).writes.map((w) => w.reg)).toContain("TA0CCR0");
  });
});

describe("MSP430G2553 triggered firmware", () => {
  it("runs from the calibrated DCO only: LFXT1 is refused on clockSource with the reason", () => {
    const plan = planTarget(msp430TriggerRequest()) as BundlePlan;
    expect(plan.clockSource).toBe("dco-cal");
    const err = expectEngineError(
      () => msp430g2553TriggerView({ ...plan, clockSource: "lfxt1", clockHz: 32768 }),
      "invalid-request",
    );
    expect(err.field).toBe("clockSource");
    expect(err.message).toBe(
      "msp430g2553: triggered firmware runs from the calibrated DCO only (CPU and timer on one clock, so the stated latency holds); not from LFXT1 32.768 kHz crystal",
    );
  });

  it("takes port-1 pins by their whole name only", () => {
    const plan = planTarget(msp430TriggerRequest()) as BundlePlan;
    expect([plan.pin.port, plan.input?.port]).toEqual(["P1.2", "P1.3"]);
    expect(msp430g2553TriggerView(plan)).not.toBeNull();
    for (const port of ["P1.10", "P1.6x", "XP1.6", "P2.1", "P1.8"]) {
      const out = expectEngineError(() => msp430g2553TriggerView(onPort(plan, port)), "invalid-request");
      expect(out.message).toBe(`msp430g2553: pins ${port} / P1.3`);
      const inp = expectEngineError(
        () => msp430g2553TriggerView({ ...plan, input: { ...plan.input!, port } }),
        "invalid-request",
      );
      expect(inp.message).toBe(`msp430g2553: pins P1.2 / ${port}`);
    }
    // output and input on one pin
    expect(
      expectEngineError(() => msp430g2553TriggerView(onPort(plan, "P1.3")), "invalid-request").message,
    ).toBe("msp430g2553: pins P1.3 / P1.3");
  });
});
