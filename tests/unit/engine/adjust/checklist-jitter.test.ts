import { describe, expect, it } from "vitest";
import { buildAdcTable, travelChecklist, type Stage } from "@/lib/engine";

// 555 astable, T = ln2*(Ra + 2*Rb)*C (NE555 datasheet, TI SLFS022).
const astable: Stage = { kind: "timer555-astable", supplyV: 12, ra: 1e3, rb: 10e3, c: 1e-6 };
const pot = { kind: "pot", field: "rb", seriesR: 2.2e3, trackR: 47e3, taper: "linear" } as const;

describe("checklist limits of a table whose plan has edge jitter", () => {
  const table = buildAdcTable({
    stage: astable,
    control: pot,
    device: "rp2040",
    clockHz: 125e6,
    adcBits: 12,
    steps: 64,
  });
  it("widens each limit by the jitter as well as the clock and one count", () => {
    const plan = table.plan;
    const lines = travelChecklist(table, 50);
    // RP2040 datasheet section 4.5 (PWM, fractional divider): single periods vary by one
    // system clock, 1 / 125 MHz = 8 ns here.
    expect(plan.divider % 1).not.toBe(0);
    expect(plan.jitterS).toBeCloseTo(1 / 125e6, 15);
    const count = (plan.divider * plan.modeFactor) / 125e6;
    // The product's own checklist rule (lib/bundle/limits.ts, CHECKLIST.md): achieved ±
    // (clock accuracy × value + jitter + one timer count).
    const p = table.steps[0].periodS;
    expect(lines[0].maxS - p).toBeCloseTo(p * 50e-6 + plan.jitterS + count, 12);
    expect(p - lines[0].minS).toBeCloseTo(p * 50e-6 + plan.jitterS + count, 12);
  });
});
