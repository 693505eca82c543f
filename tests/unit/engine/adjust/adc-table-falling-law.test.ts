// A rate pot whose period falls as the wiper turns: the one timer divider of the
// table is the one planned for the longest period of the travel (adc-table.ts, the
// product's rule "one divider for the whole table, the one the solver picks for
// the longest period"), which here is the first step, not the last.
import { describe, expect, it } from "vitest";
import { buildAdcTable, type Stage } from "@/lib/engine";

describe("ADC table of a pot on the op-amp relaxation oscillator's feedback R1", () => {
  it("plans the divider for step 0, the longest period, and every step fits that plan", () => {
    // Our own demo values. Op-amp astable with positive feedback fraction beta = R2 / (R1 + R2),
    // T = 2 R C ln((1 + beta) / (1 - beta)) (standard op-amp relaxation oscillator result, from memory):
    // a larger R1 gives a smaller beta and a shorter period.
    const stage: Stage = { kind: "opamp-relaxation", r: 10e3, c: 1e-6, feedbackR1: 10e3, feedbackR2: 10e3 };
    const pot = { kind: "pot", field: "feedbackR1", seriesR: 2.2e3, trackR: 47e3, taper: "linear" } as const;
    const table = buildAdcTable({
      stage,
      control: pot,
      device: "atmega328p",
      clockHz: 16e6,
      adcBits: 10,
      steps: 16,
    });
    const period = (r1: number) => {
      const beta = 10e3 / (r1 + 10e3);
      return 2 * 10e3 * 1e-6 * Math.log((1 + beta) / (1 - beta));
    };
    const first = table.steps[0];
    const last = table.steps.at(-1)!;
    expect(first.wantS / period(2.2e3)).toBeCloseTo(1, 9);
    expect(last.wantS / period(2.2e3 + 47e3)).toBeCloseTo(1, 9);
    expect(first.wantS).toBeGreaterThan(last.wantS);
    // The solver's plan is the longest step's; no step needs more counts than the plan holds.
    expect(first.periodCounts).toBe(table.plan.periodCounts);
    for (const s of table.steps) expect(s.periodCounts).toBeLessThanOrEqual(table.plan.periodCounts);
    // Each step within half a count of its own period (rounded to the nearest count).
    const tick = table.plan.divider / 16e6;
    for (const s of table.steps) expect(Math.abs(s.periodS - s.wantS)).toBeLessThanOrEqual(tick / 2 + 1e-15);
  });
});
