// The kept control's one-divider plan (lib/engine/adjust/adc-table.ts
// commonDividerPlan), shared by the rate pot's ADC table and the selector:
// every setting runs on the divider of the longest period, in hardware PWM.
// ATtiny25/45/85 datasheet (DS40001911), 11.7.3 Fast PWM Mode and 11.9.3
// TCCR0B: an 8-bit count (TOP at most 255) and a clock divided by at most
// 1024, so the longest fast-PWM period at 8 MHz is 1024 x 256 / 8 MHz = 32.768 ms.
import { describe, expect, it } from "vitest";
import { commonDividerPlan } from "@/lib/engine/adjust";
import { expectEngineError } from "../expect-engine-error";

const req = { device: "attiny85", clockHz: 8e6, timer: "TIMER0" };

describe("the kept control's one-divider plan", () => {
  it("a longest period inside Timer0's reach is planned in hardware PWM; one count is divider / clock", () => {
    const { plan, tick } = commonDividerPlan(req, { periodS: 32.768e-3, highS: 8.192e-3 });
    expect(plan.mode).toBe("pwm");
    expect(plan.divider).toBe(1024);
    expect(plan.periodCounts).toBe(256);
    expect(tick).toBeCloseTo(1024 / 8e6, 15);
  });

  it("a longer one is refused on control, in words that fit a pot and a selector alike", () => {
    const err = expectEngineError(
      () => commonDividerPlan(req, { periodS: 1, highS: 0.25 }),
      "invalid-request",
      "control",
    );
    expect(err.message).toBe(
      "The longest period of the control's travel needs a software divider on this clock; the kept control needs it in hardware PWM, one divider for every setting: choose a lower clock.",
    );
    expect(err.message).not.toMatch(/ADC/);
  });
});
