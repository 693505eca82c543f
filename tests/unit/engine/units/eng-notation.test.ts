// Engineering notation: IEC 60062 letter-and-digit codes (the letter stands
// for the decimal point and the multiplier: R47, 4R7, 4K7, 2M2, p68, 4n7, 4µ7)
// and SI prefixes (SI Brochure, 9th ed.: k, M, G, T, m, µ, n, p, f).
import { describe, expect, it } from "vitest";
import { formatEng, parseEng } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

describe("parseEng: IEC 60062 codes", () => {
  // Resistance code examples in the style of IEC 60062's table (R, K, M, G, T
  // letters as decimal point); capacitance codes with p, n, µ (from memory).
  const codes: [string, number][] = [
    ["R47", 0.47],
    ["4R7", 4.7],
    ["47R", 47],
    ["470R", 470],
    ["4K7", 4700],
    ["4k7", 4700],
    ["47K", 47e3],
    ["1M0", 1e6],
    ["2M2", 2.2e6],
    ["1G5", 1.5e9],
    ["p68", 0.68e-12],
    ["6p8", 6.8e-12],
    ["1n0", 1e-9],
    ["4n7", 4.7e-9],
    ["100n", 100e-9],
    ["1µ0", 1e-6],
    ["4u7", 4.7e-6],
    ["4μ7", 4.7e-6], // Greek mu typed instead of the micro sign
    ["4m7", 4.7e-3],
  ];
  for (const [text, value] of codes) {
    it(`${text} = ${value}`, () => expect(parseEng(text)).toBe(value));
  }
});

describe("parseEng: SI prefixes and units", () => {
  const cases: [string, number, Parameters<typeof parseEng>[1]?][] = [
    ["4.7 kΩ", 4700, "Ω"],
    ["4.7k ohm", 4700, "Ω"],
    ["10 kohms", 10e3, "Ω"],
    ["100 nF", 100e-9, "F"],
    ["2.34 ms", 2.34e-3, "s"],
    ["250us", 250e-6, "s"],
    ["250 µs", 250e-6, "s"],
    ["10 kHz", 10e3, "Hz"],
    ["1.5 MHz", 1.5e6, "Hz"],
    ["12 V", 12, "V"],
    ["-5 V", -5, "V"],
    ["5 mA", 5e-3, "A"],
    ["1F", 1, "F"], // one farad, not femto
    ["1f", 1e-15],
    ["1 fF", 1e-15, "F"],
    ["1e3", 1000],
    ["1.5e-6 F", 1.5e-6, "F"],
    [".47", 0.47],
    ["5 %", 0.05, "%"],
    ["50 ppm", 50e-6, "ppm"],
    ["  33k  ", 33e3],
  ];
  for (const [text, value, unit] of cases) {
    it(`"${text}" = ${value}`, () => expect(parseEng(text, unit)).toBe(value));
  }
});

// The SI Brochure (9th ed., section 5.4, from memory) allows either the point
// or the comma as the decimal marker, so "1,500" may mean 1.5; commas as
// thousands separators (groups of three) are common practice, no source: read
// only where no decimal comma fits (two or more groups, or a point after them).
describe("parseEng: thousands separators", () => {
  const read: [string, number][] = [
    ["16,000,000", 16e6],
    ["16,000,000 Hz", 16e6],
    ["-2,200,000", -2.2e6],
    ["1,500.5", 1500.5],
    ["1,500.5 Ω", 1500.5],
  ];
  for (const [text, value] of read) it(`${text} = ${value}`, () => expect(parseEng(text)).toBe(value));
  it("refuses one group without a point, naming both readings", () => {
    const err = expectEngineError(() => parseEng("1,500"), "invalid-value");
    expect(err.message).toBe(
      'Cannot read "1,500" as a value: "1,500" could be a thousands separator or a decimal comma; write it without the comma.',
    );
    expect(expectEngineError(() => parseEng("1,5"), "invalid-value").message).toBe(
      'Cannot read "1,5" as a value: use a point as the decimal separator.',
    );
  });
});

describe("parseEng refuses what it cannot read", () => {
  for (const text of [
    "",
    "R",
    "abc",
    "4k7k",
    "1..2",
    "1,5k",
    "k47",
    "4.7 kX",
    "10 furlongs",
    "--5",
    "4k7.1",
  ]) {
    it(`"${text}"`, () => {
      const err = expectEngineError(() => parseEng(text), "invalid-value");
      expect(err.message).toContain("Cannot read");
    });
  }
  it("a unit that is not the expected one", () => {
    expectEngineError(() => parseEng("100 nF", "Ω"), "invalid-value");
    expectEngineError(() => parseEng("4R7 F", "F"), "invalid-value");
  });
});

describe("formatEng", () => {
  const cases: [number, Parameters<typeof formatEng>[1], string][] = [
    [4700, "Ω", "4.7 kΩ"],
    [4700, "ohm", "4.7 kΩ"],
    [100e-9, "F", "100 nF"],
    [2.34e-3, "s", "2.34 ms"],
    [2.3456e-3, "s", "2.35 ms"],
    [4.7e-6, "F", "4.7 µF"],
    [0.47, "Ω", "470 mΩ"],
    [999.96, "Ω", "1 kΩ"], // rounding carries into the next prefix
    [1e6, "Hz", "1 MHz"],
    [0, "V", "0 V"],
    [-12, "V", "-12 V"],
    [4700, "", "4.7k"],
    [0.05, "%", "5 %"],
    [NaN, "s", "—"],
  ];
  for (const [value, unit, text] of cases) {
    it(`${value} ${unit} -> "${text}"`, () => expect(formatEng(value, unit)).toBe(text));
  }
  it("round-trips through parseEng", () => {
    for (const v of [4.7e3, 2.2e6, 100e-9, 4.7e-6, 1.5e-12, 33, 0.22]) {
      expect(parseEng(formatEng(v, "Ω"), "Ω")).toBe(v);
    }
  });
});
