// Changed numbers between two revisions. The stage values are the worked
// 555 astable of the NE555 datasheet (TI SLFS022, "Astable operation":
// t_H = 0.693 (RA + RB) C, t_L = 0.693 RB C), planned with the
// engine, so a change of RB must show up as RB, the old period and high time,
// and the target's counts and registers, and nothing else.
import { describe, expect, it } from "vitest";
import { changedNumbers, formatValue } from "@/lib/diff";
import { astableSnapshot } from "./astable-snapshot";

const snapshot = astableSnapshot;

describe("changedNumbers", () => {
  it("lists nothing for identical revisions", () => {
    expect(changedNumbers(snapshot(10e3), snapshot(10e3))).toEqual([]);
  });

  it("lists RB, the old stage's timing and the target's registers when RB changes", () => {
    const a = snapshot(10e3);
    const b = snapshot(4.7e3);
    const rows = changedNumbers(a, b);
    const keys = rows.map((r) => r.key);
    expect(keys).toContain("stage.rb");
    expect(keys).toContain("analysis.periodS");
    expect(keys).toContain("analysis.highS");
    expect(keys).toContain("target1.periodS");
    expect(keys.some((k) => k.startsWith("target1.registers."))).toBe(true);
    // Unchanged inputs stay out of the table.
    for (const k of [
      "stage.ra",
      "stage.c",
      "stage.supplyV",
      "stage.kind",
      "target1.device",
      "target1.clockHz",
    ]) {
      expect(keys).not.toContain(k);
    }
    const rb = rows.find((r) => r.key === "stage.rb")!;
    expect([rb.before, rb.after]).toEqual(["10 kΩ", "4.7 kΩ"]);
    // NE555 datasheet: t_H = 0.693 (RA + RB) C; with RA 1 k, RB 10 k, C 1 µF: 7.623 ms.
    const high = rows.find((r) => r.key === "analysis.highS")!;
    expect(high.beforeValue as number).toBeCloseTo(0.693 * 11e3 * 1e-6, 4);
  });

  it("shows a target that exists on one side only against a dash", () => {
    const a = snapshot(10e3);
    const b = { ...a, plans: [] };
    const rows = changedNumbers(a, b);
    const device = rows.find((r) => r.key === "target1.device")!;
    expect(device).toMatchObject({ before: "atmega328p", after: "—", afterValue: null });
  });
});

describe("formatValue", () => {
  it("prints registers in hex and decimal, errors in ppm, duty in %", () => {
    expect(formatValue({ value: 0x82, unit: "", fmt: "hex" })).toBe("0x82 (130)");
    expect(formatValue({ value: -12.5, unit: "ppm", fmt: "ppm" })).toBe("-12.5 ppm");
    expect(formatValue({ value: 0.52381, unit: "%", fmt: "percent" })).toBe("52.38 %");
    expect(formatValue({ value: 2.34e-3, unit: "s", fmt: "eng" })).toBe("2.34 ms");
    expect(formatValue(undefined)).toBe("—");
  });
});
