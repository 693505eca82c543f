// ATtiny85 Timer/Counter1 in the bundle: OCR1C holds TOP, so the period is
// N * (1 + OCR1C) / f, and OCR1C is an 8-bit register (ATtiny25/45/85
// datasheet DS2586, Timer/Counter1: PWM1A with TOP = OCR1C, CTC1 clears on
// OCR1C; register OCR1C 8 bits). A plan whose count does not fit is refused
// naming the register, the value and its range; the refusal's lower end
// (OCR1C >= 1) is the bundle's own rule (common practice, no source).
import { describe, expect, it } from "vitest";
import type { BundlePlan } from "@/lib/bundle";
import { DEVICES } from "@/lib/bundle/devices";
import { avrTriggerView } from "@/lib/bundle/trigger-avr";
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

describe("ATtiny85 triggered one-shot: each timer's own control registers", () => {
  // DS2586: Timer/Counter1 has a single control register TCCR1 whose CS13:10 select
  // CK/2^(CS - 1) (0001 = CK .. 1101 = CK/4096 .. 1111 = CK/16384), with channel B's
  // set-up in GTCCR; Timer/Counter0 selects its clock with CS02:00 in TCCR0B
  // (100 = clk/256) beside TCCR0A (table numbers not checked: from memory).
  const triggered = (periodS: number, highS: number, delayS: number, timer?: string) =>
    planTarget({
      device: "attiny85",
      clockHz: 8e6,
      periodS,
      highS,
      mode: "isr",
      start: "trigger",
      delayS,
      ...(timer ? { timer } : {}),
    }) as BundlePlan;

  it("Timer1 at CK/4096 writes TCCR1 with CS13:10 = 1101 and GTCCR", () => {
    // 10 ms delay + 110 ms pulse: beyond Timer0's 256 x 1024 / 8 MHz = 32.8 ms, so Timer1 is planned
    const p = triggered(0.5, 0.11, 0.01);
    expect([p.timer, p.divider]).toEqual(["TIMER1", 4096]);
    const v = avrTriggerView(p)!;
    expect([v.ctrl, v.csValue, v.ctrlOther]).toEqual(["TCCR1", 0b1101, "GTCCR"]);
  });

  it("Timer0 at clk/256 writes TCCR0B with CS02:00 = 100 and TCCR0A", () => {
    const p = triggered(0.01, 1e-3, 4e-3, "TIMER0");
    expect([p.timer, p.divider]).toEqual(["TIMER0", 256]);
    const v = avrTriggerView(p)!;
    expect([v.ctrl, v.csValue, v.ctrlOther]).toEqual(["TCCR0B", 0b100, "TCCR0A"]);
  });
});
