// What the board does, old vs new. Stage: the NE555 astable of the NE555
// datasheet (TI SLFS022, "Astable operation": t_H = 0.693 (RA + RB) C,
// t_L = 0.693 RB C), planned by the engine for an ATmega328P at 16 MHz, so
// the period the board makes follows the datasheet formula and the
// difference shown must be the formula's difference.
import { describe, expect, it } from "vitest";
import { boardChanges } from "@/lib/diff/board";
import { accuracyBudget, analyzeStage, planTarget } from "@/lib/engine";

function snapshot(rb: number, withBudget = true) {
  const stage = { kind: "timer555-astable" as const, supplyV: 12, ra: 1e3, rb, c: 1e-6 };
  const analysis = analyzeStage(stage);
  const plan = planTarget({
    device: "atmega328p",
    clockHz: 16e6,
    periodS: analysis.periodS,
    highS: analysis.highS,
    mode: "pwm",
  });
  const budget = withBudget ? accuracyBudget(plan, { toleranceRelative: 0.02 }) : null;
  return { plans: [{ target: {}, plan, budget }] };
}

// Parses "+1.23 ms (−4.5 %)" into seconds.
function seconds(text: string): number {
  const m = /^([+−])([\d.]+) (ms|µs|s)/.exec(text);
  if (!m) throw new Error(`not a difference: ${text}`);
  const scale = { s: 1, ms: 1e-3, µs: 1e-6 }[m[3] as "s" | "ms" | "µs"];
  return (m[1] === "−" ? -1 : 1) * Number(m[2]) * scale;
}

describe("boardChanges", () => {
  it("shows no difference for the same revision", () => {
    const [t] = boardChanges(snapshot(10e3), snapshot(10e3));
    expect(t.device).toBe("atmega328p");
    expect(t.deviceName).toBe("ATmega328P");
    expect(t.quantities.every((q) => !q.changed && q.difference === "")).toBe(true);
  });

  it("gives the datasheet period difference when RB goes 10 kΩ -> 4.7 kΩ", () => {
    const [t] = boardChanges(snapshot(10e3), snapshot(4.7e3));
    const period = t.quantities.find((q) => q.key === "periodS")!;
    const high = t.quantities.find((q) => q.key === "highS")!;
    // NE555: T = 0.693 (RA + 2 RB) C: 14.55 ms -> 7.207 ms, a change of 0.693 * 2 * 5.3 kΩ * 1 µF = −7.346 ms.
    expect(period.changed).toBe(true);
    expect(Math.abs(seconds(period.difference) - -0.693 * 2 * 5.3e3 * 1e-6) / 7.346e-3).toBeLessThan(2e-3);
    // t_H = 0.693 (RA + RB) C: 7.623 ms -> 3.950 ms, −3.673 ms.
    expect(Math.abs(seconds(high.difference) - -0.693 * 5.3e3 * 1e-6) / 3.673e-3).toBeLessThan(2e-3);
    // Relative: (7.207 − 14.55) / 14.55 = −50.5 %.
    expect(period.difference).toMatch(/\(−50\.\d %\)$/);
    expect(period.before).toMatch(/ms$/);
  });

  it("states the budget against the allowed tolerance and the verdict per side", () => {
    const [t] = boardChanges(snapshot(10e3), snapshot(4.7e3));
    const budget = t.quantities.find((q) => q.key === "budgetPpm")!;
    // 2 % required = 20 000 ppm allowed.
    expect(budget.after).toMatch(/ppm of 20000 ppm allowed$/);
    expect(t.verdictAfter).toBe("meets");
  });

  it("says a side is missing rather than inventing a number", () => {
    const [t] = boardChanges({ plans: [] }, snapshot(10e3, false));
    const period = t.quantities.find((q) => q.key === "periodS")!;
    expect(period.before).toBe("—");
    expect(period.difference).toBe("");
    expect(t.quantities.find((q) => q.key === "budgetPpm")!.after).toBe("—");
    expect(t.verdictAfter).toBeNull();
  });
});
