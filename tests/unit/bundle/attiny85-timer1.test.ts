// ATtiny85 Timer/Counter1 in the bundle: OCR1C holds TOP, so the period is
// N * (1 + OCR1C) / f, and OCR1C is an 8-bit register (ATtiny25/45/85
// datasheet DS2586, Timer/Counter1: PWM1A with TOP = OCR1C, CTC1 clears on
// OCR1C; register OCR1C 8 bits). A plan whose count does not fit is refused
// naming the register, the value and its range; the refusal's lower end
// (OCR1C >= 1) is the bundle's own rule (common practice, no source).
import { describe, expect, it } from "vitest";
import type { BundlePlan } from "@/lib/bundle";
import { DEVICES } from "@/lib/bundle/devices";
import { planTarget } from "@/lib/engine";
import { TARGETS } from "./fixtures";
import { expectEngineError } from "../engine/expect-engine-error";

// attiny85, 8 MHz, 1 ms PWM on TIMER1 (fixtures)
const plan = planTarget(TARGETS[5]) as BundlePlan;
const view = (p: BundlePlan) => DEVICES.attiny85.view(p);
// a register range refusal is bad input (our 4xx shape), so its message is the user's
const refusal = (p: BundlePlan) => expectEngineError(() => view(p), "invalid-request").message;

describe("ATtiny85 Timer1 OCR1C", () => {
  it("OCR1C = periodCounts - 1, so N * (1 + OCR1C) / f is the planned 1 ms", () => {
    expect(plan.timer).toBe("TIMER1");
    const ocr1c = view(plan).writes.find((w) => w.reg === "OCR1C")!;
    expect(ocr1c.value).toBe(plan.periodCounts - 1);
    expect((plan.divider * (1 + ocr1c.value)) / 8e6).toBeCloseTo(1e-3, 12);
  });

  it.each(["pwm", "toggle", "isr"] as const)(
    "%s: 256 counts do not fit OCR1C and are refused by name",
    (mode) => {
      const p = { ...plan, mode, periodCounts: 257 };
      expect(refusal(p)).toBe(`attiny85: OCR1C = 256 is outside 1..255 (timer TIMER1, mode ${mode})`);
    },
  );

  it("one count (OCR1C = 0) is refused too; 256 counts (OCR1C = 255) are taken", () => {
    expect(refusal({ ...plan, periodCounts: 1, highCounts: 1 })).toBe(
      "attiny85: OCR1C = 0 is outside 1..255 (timer TIMER1, mode pwm)",
    );
    const top = view({ ...plan, periodCounts: 256 }).writes.find((w) => w.reg === "OCR1C")!;
    expect(top.value).toBe(255);
  });
});

describe("ATtiny85 Timer0 OCR0A (8-bit TOP in modes 2 and 7)", () => {
  // DS2586, Timer/Counter0: CTC (mode 2) and fast PWM (mode 7) count to TOP = OCR0A, an 8-bit register
  const t0 = planTarget(TARGETS[3]) as BundlePlan;

  it("256 counts do not fit OCR0A and are refused by name", () => {
    expect(t0.timer).toBe("TIMER0");
    expect(refusal({ ...t0, periodCounts: 257 })).toBe(
      "attiny85: OCR0A = 256 is outside 1..255 (timer TIMER0, mode pwm)",
    );
  });
});
