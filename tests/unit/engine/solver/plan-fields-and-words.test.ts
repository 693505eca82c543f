// Plan fields and words a fresh mutation sample (seed 53) showed no test
// holding: the interrupt interval of a plan without interrupts, the jitter of
// a whole RP2040 divider, the first note of a triggered plan, and the clock
// source a refused frequency names.
import { describe, expect, it } from "vitest";
import { planTarget, type PlanRequest } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

describe("interrupt interval only on interrupt plans", () => {
  // lib/engine/plan-types.ts, TimerPlan.interruptIntervalS: "isr plans: time
  // between interrupts; null otherwise". A pwm or toggle plan runs in the
  // timer hardware alone (engine.md section 3), so it has no interval.
  const base: PlanRequest = { device: "atmega328p", clockHz: 16e6, periodS: 1e-3, highS: 0.5e-3 };
  for (const mode of ["pwm", "toggle"] as const)
    it(`a ${mode} plan has no interrupt interval`, () => {
      const p = planTarget({ ...base, mode });
      expect(p.mode).toBe(mode);
      expect(p.interruptIntervalS).toBeNull();
      expect(p.interruptIntervalCycles).toBeNull();
    });
});

describe("a whole RP2040 divider adds no jitter", () => {
  // RP2040 datasheet, PWM chapter: the divider is DIV_INT + DIV_FRAC/16; a
  // fractional part makes the counter step alternate between DIV_INT and
  // DIV_INT + 1 system clocks (from memory), DIV_FRAC = 0 steps evenly.
  // lib/engine/plan-types.ts, TimerPlan.jitterS: "0 for pure hardware; one sys
  // clock for a fractional RP2040 divider".
  it("1 ms at 125 MHz plans with divider 1: jitter 0, no fractional note", () => {
    const p = planTarget({ device: "rp2040", clockHz: 125e6, periodS: 1e-3, highS: 0.25e-3 });
    expect(Number.isInteger(p.divider)).toBe(true);
    expect(p.divFrac).toBe(0);
    expect(p.jitterS).toBe(0);
    expect(p.notes.filter((n) => n.startsWith("Fractional divider"))).toEqual([]);
  });
});

describe("a triggered plan's first note names what starts the timer", () => {
  // engine.md section 6: "trigger" starts on a trigger edge, "zero-cross" at
  // each zero crossing of the mains; the first note says which (the
  // product's own wording, lib/engine/solver/triggered.ts).
  const base: PlanRequest = { device: "atmega328p", clockHz: 16e6, periodS: 0.01, highS: 1e-4, delayS: 5e-3 };
  it("a trigger one-shot: each trigger, not a mains zero crossing", () => {
    const first = planTarget({ ...base, start: "trigger" }).notes[0];
    expect(first.startsWith("Each trigger (")).toBe(true);
    expect(first).not.toContain("zero crossing");
  });
  it("a zero-cross plan: each mains zero crossing", () => {
    const first = planTarget({ ...base, start: "zero-cross" }).notes[0];
    expect(first.startsWith("Each mains zero crossing (")).toBe(true);
  });
});

describe("a frequency one internal source cannot make names the source that makes it", () => {
  // PIC12F1840 datasheet (DS40001441), oscillator module: the HFINTOSC with
  // its IRCF postscaler gives at most 16 MHz; 32 MHz internal is the 8 MHz
  // HFINTOSC through the 4x PLL (SPLLEN), from memory. The refusal points to
  // that option (lib/engine/solver/validate.ts, checkClockChoice).
  it("32 MHz on hfintosc points to hfintosc-pll", () => {
    const e = expectEngineError(
      () =>
        planTarget({
          device: "pic12f1840",
          clockSource: "hfintosc",
          clockHz: 32e6,
          periodS: 1e-3,
          highS: 0.5e-3,
        }),
      "clock-out-of-range",
    );
    expect(e.field).toBe("clockHz");
    expect(e.message).toContain("; 32000000 Hz is clock source hfintosc-pll.");
  });
});
