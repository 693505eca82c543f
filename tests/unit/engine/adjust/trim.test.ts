// A trimmer's calibration constant: its range is the old stage's period with
// the trimmer at either end, in counts of the target's timer, and the high
// time follows the stage's law. Old stage: 555 astable, T = ln2*(Ra + 2*Rb)*C,
// high = ln2*(Ra + Rb)*C (NE555 datasheet, TI SLFS022). One count of
// ATmega328P Timer1 at divider 1 is 1/16 MHz (DS40002061, Timer/Counter1).
import { describe, expect, it } from "vitest";
import { analyzeStage, buildTrimRange, planTarget, trimHighCounts, type Stage } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

const stage: Stage = { kind: "timer555-astable", supplyV: 5, ra: 1e3, rb: 10e3, c: 100e-9 };
const trimmer = { kind: "trimmer", field: "rb", seriesR: 8.2e3, trackR: 4.7e3 } as const;
const LN2 = Math.log(2);
const period = (rb: number) => LN2 * (1e3 + 2 * rb) * 100e-9;
const high = (rb: number) => LN2 * (1e3 + rb) * 100e-9;
const plan = planTarget({
  device: "atmega328p",
  clockHz: 16e6,
  periodS: period(10e3),
  highS: high(10e3),
  mode: "pwm",
  timer: "TIMER1",
});
// Built inside each test: a refusal here then fails that test instead of the
// file's loading (which the mutation runner would not count as a failure).
const trimRange = () => buildTrimRange(stage, trimmer, plan);
const count = 1 / 16e6;

describe("trimmer calibration range", () => {
  it("runs from Rb = seriesR to seriesR + trackR in timer counts (NE555 formula)", () => {
    const range = trimRange();
    expect(plan.divider).toBe(1);
    expect(range.countS).toBeCloseTo(count, 15);
    // the engine's 555 model may add the discharge's own small terms: within one count of the formula
    expect(Math.abs(range.min.periodCounts - period(8.2e3) / count)).toBeLessThanOrEqual(1);
    expect(Math.abs(range.max.periodCounts - period(12.9e3) / count)).toBeLessThanOrEqual(1);
    expect(Math.abs(range.min.highCounts - high(8.2e3) / count)).toBeLessThanOrEqual(1);
    expect(Math.abs(range.max.highCounts - high(12.9e3) / count)).toBeLessThanOrEqual(1);
    expect(range.stored).toEqual({ periodCounts: plan.periodCounts, highCounts: plan.highCounts });
  });

  it("the high time of any constant follows the 555's law within one count", () => {
    const range = trimRange();
    // 555: Rb = (T/(ln2 C) - Ra)/2, so high = ln2*C*(Ra + Rb) is linear in T
    for (const n of [
      range.min.periodCounts + 1,
      21000,
      range.stored.periodCounts,
      27000,
      range.max.periodCounts,
    ]) {
      const rb = ((n * count) / (LN2 * 100e-9) - 1e3) / 2;
      expect(Math.abs(trimHighCounts(range, n) - high(rb) / count), `n = ${n}`).toBeLessThanOrEqual(1);
    }
    expect(trimHighCounts(range, range.stored.periodCounts)).toBe(plan.highCounts);
  });

  it("refuses a stored value outside the trimmer, a pot, and a plan that is not hardware PWM", () => {
    expectEngineError(
      () => buildTrimRange({ ...stage, rb: 20e3 }, trimmer, plan),
      "invalid-request",
      "stage.rb",
    );
    expectEngineError(
      () => buildTrimRange(stage, { ...trimmer, kind: "pot", taper: "linear" }, plan),
      "invalid-request",
      "control.kind",
    );
    expectEngineError(
      () => buildTrimRange(stage, trimmer, { ...plan, mode: "isr" }),
      "invalid-request",
      "mode",
    );
  });

  it("refuses a plan whose period lies outside the trimmer's travel, on either side", () => {
    // Rb 10 kΩ is inside 8.2..12.9 kΩ, but plans made for Rb 5 kΩ and 20 kΩ
    // (NE555 formula above) are shorter than the shortest and longer than the
    // longest period the trimmer reaches.
    for (const rb of [5e3, 20e3]) {
      const other = planTarget({
        device: "atmega328p",
        clockHz: 16e6,
        periodS: period(rb),
        highS: high(rb),
        mode: "pwm",
        timer: "TIMER1",
      });
      expectEngineError(() => buildTrimRange(stage, trimmer, other), "invalid-request", "stage.rb");
    }
  });

  it("refuses a trimmer whose end stops the stage, saying which end", () => {
    // UJT load line: R below (Vs - Vp)/Ip, 768 kΩ here (General Electric SCR Manual, from memory);
    // 400 kΩ + 1 MΩ at the end is above it.
    const ujt: Stage = { kind: "ujt", supplyV: 12, timingR: 500e3, timingC: 1e-6, eta: 0.63 };
    const a = analyzeStage(ujt);
    const ujtPlan = planTarget({
      device: "atmega328p",
      clockHz: 16e6,
      periodS: a.periodS,
      highS: a.highS,
      mode: "pwm",
      timer: "TIMER1",
    });
    const err = expectEngineError(
      () => buildTrimRange(ujt, { kind: "trimmer", field: "timingR", seriesR: 400e3, trackR: 1e6 }, ujtPlan),
      "invalid-request",
    );
    expect(err.field).toBe("control");
    expect(err.message).toBe(
      "With the trimmer at its end the stage does not run; keep the whole travel inside its limits.",
    );
  });

  it("refuses a travel whose shortest period is one timer count and takes one of two counts", () => {
    // A PWM period of n counts can be high for 1 .. n - 1 of them (engine.md:
    // high for OCR1A + 1 counts of a TOP + 1 period), so a trimmer whose
    // shortest period rounds to one count cannot keep both levels; the refusal
    // is the product's own message. The plan is this file's ATmega328P plan
    // with the count length set by hand: the shortest period (Rb = seriesR,
    // NE555 formula) is 1.2 counts, then 2.2 counts.
    const shortest = period(8.2e3);
    const withCounts = (countsAtShortest: number) => {
      const countS = shortest / countsAtShortest;
      return {
        ...plan,
        clockHz: 1 / countS,
        divider: 1,
        modeFactor: 1,
        periodCounts: Math.round(period(10e3) / countS),
        highCounts: 1,
      };
    };
    const err = expectEngineError(() => buildTrimRange(stage, trimmer, withCounts(1.2)), "invalid-request");
    expect(err.field).toBe("control");
    expect(err.message).toBe("The trimmer's shortest period is under two timer counts.");
    const two = buildTrimRange(stage, trimmer, withCounts(2.2));
    expect(two.min.periodCounts).toBe(2);
    expect(two.max.periodCounts).toBe(Math.round(period(12.9e3) / (shortest / 2.2)));
  });
});
