// The verdict shown in the plans table and on the revision page
// (components/retrofit/budget-verdict.tsx), from real engine budgets. The
// case is the one issue 16 reported: a toggle-mode "gate pulse" of half the
// period given to a gate that wants a short pulse must show "misses", with the
// gate's finding as the reason, even though the period tolerance is met.
// Gate pulse needs here are demo-style numbers, not from a thyristor datasheet.
import { describe, expect, it } from "vitest";
import { verdictOf } from "@/components/retrofit/budget-verdict";
import { accuracyBudget, planTarget, type TimerPlan } from "@/lib/engine";

const plan = planTarget({
  device: "atmega328p",
  clockHz: 16e6,
  periodS: 1 / 133,
  highS: 22e-6,
  mode: "toggle",
} as never) as TimerPlan;

describe("budget verdict shown to the user", () => {
  it("meets when the tolerance and the gate needs are met", () => {
    const b = accuracyBudget(plan, { toleranceRelative: 0.05 });
    expect(verdictOf(b)).toEqual({ verdict: "meets", reasons: [] });
  });

  it("misses on the gate-drive needs alone, naming the gate's finding", () => {
    const b = accuracyBudget(plan, { toleranceRelative: 0.05, gateDrive: { maxPulseS: 100e-6 } });
    expect(b.meetsTolerance).toBe(true);
    const v = verdictOf(b);
    expect(v.verdict).toBe("misses");
    expect(v.reasons).toHaveLength(1);
    expect(v.reasons[0]).toMatch(/maximum 100 µs/);
  });

  it("misses on the tolerance with the total and the required figure", () => {
    const b = accuracyBudget(plan, { toleranceRelative: 1e-9 });
    const v = verdictOf(b);
    expect(v.verdict).toBe("misses");
    expect(v.reasons[0]).toMatch(/is over the required/);
  });

  it("reads a stored budget without `verdict` the same way", () => {
    const b = accuracyBudget(plan, { toleranceRelative: 0.05, gateDrive: { maxPulseS: 100e-6 } });
    const { verdict: _drop, ...old } = b;
    void _drop;
    expect(verdictOf(old).verdict).toBe("misses");
  });
});
