// Column roles and header quantities of capture files (capture.md "Input"): a column named as
// time with no unit is the time axis; with no volt column the other column is measured as it
// is, with a warning; the first vertical-unit line of a header wins; header quantities are
// read as a decimal number (optional sign, point or decimal comma, E exponent with or without
// a sign) and an optional unit, nothing before or after. The traces and header values are our
// own; state levels are the histogram modes (IEEE Std 181-2011, 5.2.1.3).
import { describe, expect, it } from "vitest";
import { measureCsv } from "@/lib/capture";
import { parseQuantity } from "@/lib/capture/units";

const DT = 10e-6;
const square = (lo: number, hi: number) =>
  Array.from({ length: 500 }, (_, i) => ((i + 95) % 100 < 30 ? hi : lo));
const csv = (header: string[], names: string, v: number[]) =>
  [...header, names, ...v.map((x, i) => `${i * DT},${x}`)].join("\n") + "\n";

describe("capture columns", () => {
  it("a column named Time without a unit is the time axis, with no assumed-time warning", async () => {
    const m = await measureCsv(csv([], "Time,CH1 (V)", square(0, 5)));
    expect(m.columns[0]).toEqual({ name: "Time", unit: "", role: "time" });
    expect(m.warnings.map((w) => w.code)).not.toContain("assumed-time-column");
    // 100 samples of 10 us a period
    expect(m.periodS.mean).toBeCloseTo(100 * DT, 12);
  });

  it("with no column in volts the other column is measured as it is, and the warning names it", async () => {
    const m = await measureCsv(csv([], "Time (s),Gate (A)", square(0, 0.2)));
    expect(m.columns[1]).toMatchObject({ name: "Gate", unit: "A", role: "other" });
    expect(m.warnings).toContainEqual({
      code: "no-voltage-unit",
      message: 'no column is in volts; measuring "Gate" as it is',
    });
    expect(m.lowLevelV).toBeCloseTo(0, 12);
    expect(m.highLevelV).toBeCloseTo(0.2, 12);
  });

  it("the first vertical-unit line wins over a later one", async () => {
    const m = await measureCsv(
      csv(["Vertical Units,mV", "Vertical Units,V"], "Time (s),CH1", square(0, 5000)),
    );
    expect(m.scaling).toMatchObject({ unit: "mV", unitFrom: "header", unitScale: 1e-3 });
    expect(m.highLevelV).toBeCloseTo(5, 12);
  });
});

describe("header quantities", () => {
  it.each([
    ["1.0E-06", false, 1e-6, ""],
    ["1E3 Sa/s", false, 1e3, "Sa/s"],
    ["1e+3", false, 1e3, ""],
    ["-2.5e-3 V", false, -2.5e-3, "V"],
    ["+3 ms", false, 3, "ms"],
    [".5 us", false, 0.5, "us"],
    [".55 us", false, 0.55, "us"],
    ["5. s", false, 5, "s"],
    ["2,5E-06", true, 2.5e-6, ""],
    [",25 V", true, 0.25, "V"],
  ])("%s reads as a number and a unit", (text, comma, value, unit) => {
    const q = parseQuantity(text, comma);
    expect(q).not.toBeNull();
    expect(q!.value).toBeCloseTo(value, 15);
    expect(q!.unit).toBe(unit);
  });

  it.each([["x1 us"], ["1 us 2"], ["1,5"], ["e3"], ["."]])("%s is not a quantity", (text) => {
    expect(parseQuantity(text, false)).toBeNull();
  });
});
