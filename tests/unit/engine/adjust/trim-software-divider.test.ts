// A trimmer's calibration constant sets a hardware PWM period (trim.ts, the
// product's refusal): a plan that counts periods in software (softwareDivider
// above 1) is refused like a non-pwm plan. One count of ATmega328P Timer1 at
// divider 1 is 1/16 MHz (DS40002061, Timer/Counter1); 555 astable
// T = ln2*(Ra + 2*Rb)*C, high = ln2*(Ra + Rb)*C (NE555 datasheet, TI SLFS022).
import { describe, expect, it } from "vitest";
import { buildTrimRange, planTarget, type Stage } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

describe("trimmer calibration range: software divider", () => {
  it("refuses a pwm plan with a software divider of 2 on the mode field, with the product's text", () => {
    const stage: Stage = { kind: "timer555-astable", supplyV: 5, ra: 1e3, rb: 10e3, c: 100e-9 };
    const trimmer = { kind: "trimmer", field: "rb", seriesR: 8.2e3, trackR: 4.7e3 } as const;
    const ln2 = Math.log(2);
    const plan = planTarget({
      device: "atmega328p",
      clockHz: 16e6,
      periodS: ln2 * (1e3 + 2 * 10e3) * 100e-9,
      highS: ln2 * (1e3 + 10e3) * 100e-9,
      mode: "pwm",
      timer: "TIMER1",
    });
    expect(plan.softwareDivider).toBe(1);
    expect(() => buildTrimRange(stage, trimmer, plan)).not.toThrow();
    const err = expectEngineError(
      () => buildTrimRange(stage, trimmer, { ...plan, softwareDivider: 2 }),
      "invalid-request",
      "mode",
    );
    expect(err.message).toBe(
      "A trimmer's calibration constant sets a hardware PWM period: plan the target with mode pwm.",
    );
  });
});
