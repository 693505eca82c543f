import { describe, expect, it } from "vitest";
import { buildSelectorTable, type Stage } from "@/lib/engine";

// 555 astable (NE555 datasheet, TI SLFS022): tH = ln2·(Ra + Rb)·C, tL = ln2·Rb·C.
// With Rb = 1 Ω the low time (0.69 µs at 1 µF) is below one 4 µs count of a
// 16 MHz clock divided by 64, so the high time rounds to the whole period.
const astable: Stage = { kind: "timer555-astable", supplyV: 12, ra: 100e3, rb: 1, c: 1e-6 };

describe("selector table with a near-100 % duty stage", () => {
  it("keeps at least one low count in every position", () => {
    const t = buildSelectorTable({
      stage: astable,
      control: { kind: "selector", field: "c", values: [1e-6, 2.2e-6] },
      device: "atmega328p",
      clockHz: 16e6,
    });
    const countS = t.plan.divider / 16e6;
    for (const p of t.positions) {
      // tL = ln2·Rb·C > 0 (datasheet above): the output must still go low, so high < period.
      expect(p.wantS - p.wantHighS).toBeCloseTo(Math.LN2 * 1 * p.value, 12);
      expect(p.highCounts).toBeLessThan(p.periodCounts);
      expect(Math.abs(p.highCounts * countS - p.wantHighS)).toBeLessThanOrEqual(1.5 * countS);
    }
  });
});
