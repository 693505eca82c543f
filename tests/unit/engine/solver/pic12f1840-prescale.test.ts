// PIC12F1840 Timer2 prescale in the plan: the engine's divider counts the
// Fosc/4 instruction clock, the plan's `prescale` is Timer2's own 1:1/4/16/64.
import { describe, expect, it } from "vitest";
import { planTarget } from "@/lib/engine";

describe("PIC12F1840 Timer2 prescale", () => {
  it("a 4 ms PWM period at 16 MHz needs 1:64 and PR2 = 249", () => {
    // PIC12F1840 datasheet (DS40001441), PWM period = (PR2 + 1) * 4 * Tosc * (TMR2 prescale value);
    // T2CON T2CKPS<1:0>: 00 = 1:1, 01 = 1:4, 10 = 1:16, 11 = 1:64.
    // At 16 MHz 1:16 reaches 256 * 4 * 16 / 16 MHz = 1.024 ms only, so 4 ms takes 1:64:
    // (249 + 1) * 4 * 64 / 16 MHz = 4.000 ms.
    const plan = planTarget({
      device: "pic12f1840",
      clockSource: "hfintosc",
      clockHz: 16e6,
      periodS: 4e-3,
      highS: 1e-3,
      mode: "pwm",
    });
    expect(plan.prescale).toBe(64);
    expect(plan.registers.T2CON & 0b11).toBe(0b11);
    expect(plan.registers.PR2).toBe(249);
    expect(((plan.registers.PR2 + 1) * 4 * plan.prescale) / 16e6).toBeCloseTo(4e-3, 12);
  });
});
