// Edges of the solver that a fresh mutation sample (seed 41) showed no test
// reaching: the stated period limit itself, the interrupt plans' ordering,
// the high-time step of an interrupt plan and the compare register of a
// triggered run.
import { describe, expect, it } from "vitest";
import { planTarget } from "@/lib/engine";
import { betterIsr, type IsrChoice } from "@/lib/engine/solver/isr";
import { expectEngineError } from "../expect-engine-error";

describe("the longest period is reachable, one cycle more is not", () => {
  // The refusal says "plans can span at most N cycles": N itself is allowed.
  // N = 2^46 on every device (bounds.test.ts). At 2^23 Hz a 2^23 s period is
  // exactly 2^46 cycles (all powers of two, so the product is exact).
  const hz = 2 ** 23;
  it("plans exactly 2^46 cycles without error", () => {
    const p = planTarget({
      device: "atmega328p",
      clockHz: hz,
      periodS: 2 ** 23,
      highS: 2 ** 22,
      mode: "isr",
    });
    expect(p.periodS * hz).toBe(2 ** 46);
    expect(p.periodErrorPpm).toBe(0);
  });
  it("refuses 2^46 + 2^20 cycles naming the period", () => {
    const e = expectEngineError(
      () =>
        planTarget({
          device: "atmega328p",
          clockHz: hz,
          periodS: 2 ** 23 + 1 / 8,
          highS: 2 ** 22,
          mode: "isr",
        }),
      "unreachable-period",
    );
    expect(e.field).toBe("periodS");
    expect(e.message).toContain("can span at most");
  });
});

describe("interrupt plans: order of preference (engine.md section 3)", () => {
  // "least period error, then least high-time error, then longest interval,
  // then smallest divider". Each pair below is tied above the level it tests
  // and the later levels point the other way, so skipping a level shows.
  const base: IsrChoice = {
    divider: 8,
    periodCounts: 250,
    softwareDivider: 10,
    highCounts: 5,
    intervalCycles: 2000,
    periodErrorCycles: 0,
    highErrorCycles: 0,
  };
  it("least period error first", () => {
    const a = { ...base, periodErrorCycles: 1, highErrorCycles: 0, intervalCycles: 4000, divider: 1 };
    const b = { ...base, periodErrorCycles: 0, highErrorCycles: 9 };
    expect([betterIsr(b, a), betterIsr(a, b)]).toEqual([true, false]);
  });
  it("then least high-time error", () => {
    const a = { ...base, highErrorCycles: 3, intervalCycles: 4000, divider: 1 };
    const b = { ...base, highErrorCycles: 2 };
    expect([betterIsr(b, a), betterIsr(a, b)]).toEqual([true, false]);
  });
  it("then the longest interval, before the smaller divider", () => {
    const long = { ...base, intervalCycles: 4000, divider: 64, periodCounts: 62.5 };
    const short = { ...base, intervalCycles: 2000, divider: 1, periodCounts: 2000 };
    expect([betterIsr(long, short), betterIsr(short, long)]).toEqual([true, false]);
  });
  it("then the smallest divider", () => {
    const fine = { ...base, divider: 8 };
    const coarse = { ...base, divider: 64 };
    expect([betterIsr(fine, coarse), betterIsr(coarse, fine)]).toEqual([true, false]);
  });
});

describe("an interrupt plan's high time moves in whole interrupt intervals", () => {
  // The output changes only inside the interrupt handler, so the high time is
  // highCounts intervals and its step is one interval (divider x counts / f).
  it("ATmega328P, 16 MHz, 1 s period, 0.3 s high", () => {
    const p = planTarget({ device: "atmega328p", clockHz: 16e6, periodS: 1, highS: 0.3, mode: "isr" });
    expect(p.mode).toBe("isr");
    const interval = (p.divider * p.periodCounts) / 16e6;
    expect(p.interruptIntervalS).toBeCloseTo(interval, 15);
    expect(p.highResolutionS).toBeCloseTo(interval, 15);
    expect(p.highS).toBeCloseTo(p.highCounts * interval, 12);
  });
});

describe("a triggered run fits the compare register (PIC12F1840 Timer2)", () => {
  // The engine plans a triggered run as one count of the timer, the pulse
  // ending at the compare value delay + pulse, which must stay below the
  // timer's count of states (the engine's rule, lib/engine/solver/triggered.ts;
  // the PIC firmware then loads the two phases into PR2 one after the other).
  // Timer2 counts 8 bits (DS40001441, Timer2: TMR2 and PR2 are 8-bit), so the
  // sum must be <= 255: at Fosc/4 (4 MHz clock: 1 us per count) a 200 us delay
  // with a 55 us pulse fits, with 56 us the next prescaler (1:4) is used.
  const req = {
    device: "pic12f1840",
    clockHz: 4e6,
    start: "trigger",
    periodS: 0.01,
    delayS: 200e-6,
  } as const;
  it("255 counts at 1:1", () => {
    const p = planTarget({ ...req, highS: 55e-6 });
    expect([p.timer, p.divider, p.highCounts]).toEqual(["TIMER2", 4, 55]);
  });
  it("256 counts move to 1:4", () => {
    const p = planTarget({ ...req, highS: 56e-6 });
    expect([p.timer, p.divider, p.highCounts]).toEqual(["TIMER2", 16, 14]);
  });
});
