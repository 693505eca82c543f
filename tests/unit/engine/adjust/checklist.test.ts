import { describe, expect, it } from "vitest";
import { buildAdcTable, travelChecklist, trimmerCalibration, type Stage } from "@/lib/engine";

const LN2 = Math.log(2);
// 555 astable, T = ln2*(Ra + 2*Rb)*C (NE555 datasheet, TI SLFS022).
const astable: Stage = { kind: "timer555-astable", supplyV: 12, ra: 1e3, rb: 10e3, c: 1e-6 };
const pot = { kind: "pot", field: "rb", seriesR: 2.2e3, trackR: 47e3, taper: "linear" } as const;

describe("checklist of a kept rate pot", () => {
  const table = buildAdcTable({
    stage: astable,
    control: pot,
    device: "atmega328p",
    clockHz: 16e6,
    adcBits: 10,
    steps: 64,
  });
  const lines = travelChecklist(table, 50);
  const count = table.plan.divider / 16e6;

  it("checks minimum, middle and maximum with the datasheet period inside its limits", () => {
    expect(lines.map((l) => l.where)).toEqual(["minimum", "middle", "maximum"]);
    const at = (rb: number) => LN2 * (1e3 + 2 * rb) * 1e-6;
    expect(lines[0].minS).toBeLessThan(at(2.2e3));
    expect(lines[0].maxS).toBeGreaterThan(at(2.2e3));
    expect(lines[2].minS).toBeLessThan(at(49.2e3));
    expect(lines[2].maxS).toBeGreaterThan(at(49.2e3));
    // the middle by eye (±5 % of travel, common practice) spans Rb 2.2k + 47k*(0.45..0.55)
    expect(lines[1].minS).toBeLessThanOrEqual(at(2.2e3 + 47e3 * 0.45) + count);
    expect(lines[1].maxS).toBeGreaterThanOrEqual(at(2.2e3 + 47e3 * 0.55) - count);
  });

  it("end limits are achieved ± (50 ppm of the value + one count), the checklist rule", () => {
    const p = table.steps[0].periodS;
    expect(lines[0].maxS - p).toBeCloseTo(p * 50e-6 + count, 12);
  });
});

describe("trimmer calibration", () => {
  it("states the range the constant may take from the trimmer's two ends", () => {
    const c = trimmerCalibration(astable, { kind: "trimmer", field: "rb", seriesR: 8.2e3, trackR: 4.7e3 });
    expect(c.periodAtStartS).toBeCloseTo(LN2 * (1e3 + 2 * 8.2e3) * 1e-6, 12);
    expect(c.periodAtEndS).toBeCloseTo(LN2 * (1e3 + 2 * 12.9e3) * 1e-6, 12);
    expect(c.instruction).toMatch(/calibration constant/);
  });

  it("refuses a control that is not a trimmer, saying which kind it takes", () => {
    // A pot is kept on the new board and read by the ADC (the table above); only
    // a trimmer becomes a constant. The product's own message (checklist.ts).
    expect(() => trimmerCalibration(astable, pot)).toThrow(
      new TypeError("trimmerCalibration takes a trimmer control"),
    );
  });
});
