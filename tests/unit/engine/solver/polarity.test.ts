// Output polarity. An active-low output carries the old stage's pulse as the
// pin's LOW time, so the pin is high for the rest of the period (common
// practice, no source).
// Register values come from the same ATmega328P Fast PWM formulas as the other
// solver tests (ATmega328P datasheet, 16-bit Timer/Counter1, Fast PWM mode 14).
import { describe, expect, it } from "vitest";
import { planTarget } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

const base = { device: "atmega328p", clockHz: 16e6, periodS: 20e-3, highS: 1.5e-3, mode: "pwm" as const };

describe("active-low output", () => {
  it("keeps the period and makes the pin high for period minus the pulse", () => {
    const high = planTarget(base);
    const low = planTarget({ ...base, activeLow: true });
    expect(low.periodS).toBe(high.periodS);
    expect(low.activeLow).toBe(true);
    expect(high.activeLow).toBe(false);
    expect(low.targetHighS).toBeCloseTo(20e-3 - 1.5e-3, 15);
    // 20 ms at 16 MHz with prescaler 8: 40000 counts, 0.5 us per count; 18.5 ms = 37000 counts.
    expect(low.divider * low.periodCounts).toBe(320000);
    expect(low.highS).toBeCloseTo(18.5e-3, 12);
    expect(low.registers.OCR1A + 1).toBe(Math.round((18.5e-3 * 16e6) / low.divider));
    expect(low.notes.some((n) => /Active-low output/.test(n))).toBe(true);
    expect(high.notes.some((n) => /Active-low output/.test(n))).toBe(false);
  });

  it("works for interrupt plans too", () => {
    const p = planTarget({ ...base, periodS: 2, highS: 0.25, mode: "isr", activeLow: true });
    expect(p.mode).toBe("isr");
    expect(p.highS).toBeCloseTo(1.75, 9);
  });

  it("refuses a polarity that is not a boolean", () => {
    expectEngineError(
      () => planTarget({ ...base, activeLow: "yes" as unknown as boolean }),
      "invalid-request",
      "activeLow",
    );
  });
});
