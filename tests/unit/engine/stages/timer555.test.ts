// 555 astable and monostable against the Texas Instruments NE555 datasheet
// (SLFS022): tH = 0.693 (RA + RB) C, tL = 0.693 RB C, f = 1.44/((RA + 2 RB) C),
// monostable tw = 1.1 R C. The datasheet's constants are rounded (ln 2,
// 1/ln 2, ln 3), so agreement is checked to their printed precision.
import { describe, expect, it } from "vitest";
import { analyzeStage } from "@/lib/engine";

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe("555 astable (TI SLFS022)", () => {
  it("matches the datasheet frequency formula 1.44/((RA + 2RB) C)", () => {
    for (const [ra, rb, c] of [
      [1e3, 10e3, 10e-9],
      [4.7e3, 47e3, 1e-6],
      [10e3, 1e3, 100e-9],
      [100e3, 220e3, 4.7e-6],
    ]) {
      const a = analyzeStage({ kind: "timer555-astable", supplyV: 9, ra, rb, c });
      expect(rel(a.frequencyHz, 1.44 / ((ra + 2 * rb) * c))).toBeLessThan(0.002); // 1.44 vs 1/ln 2 = 1.4427
      expect(rel(a.highS, 0.693 * (ra + rb) * c)).toBeLessThan(0.0005);
      expect(rel(a.lowS, 0.693 * rb * c)).toBeLessThan(0.0005);
      // datasheet: duty (output high share) = (RA + RB)/(RA + 2 RB)  (from memory)
      expect(rel(a.duty, (ra + rb) / (ra + 2 * rb))).toBeLessThan(1e-12);
      expect(a.outputSignal).toBe("rect-output");
      expect(a.oscillates).toBe(true);
    }
  });

  it("RA = 1 kΩ, RB = 10 kΩ, C = 10 nF -> 6.87 kHz, 52.4 % duty (worked here from ln 2)", () => {
    // 1.44 / (21 kΩ * 10 nF) = 6857 Hz by the datasheet constant; exact ln 2 gives 6870 Hz.
    const a = analyzeStage({ kind: "timer555-astable", supplyV: 5, ra: 1e3, rb: 10e3, c: 10e-9 });
    expect(a.frequencyHz).toBeCloseTo(1 / (Math.LN2 * 21e3 * 10e-9), 6);
    expect(Math.round(a.frequencyHz)).toBe(6870);
    expect(a.duty).toBeCloseTo(11 / 21, 12);
  });

  it("a driven control pin moves both thresholds (Vctl and Vctl/2)", () => {
    // Charge from Vctl/2 to Vctl toward Vcc: tH = (RA + RB) C ln((Vcc - Vctl/2)/(Vcc - Vctl)).
    const base = { kind: "timer555-astable" as const, supplyV: 12, ra: 2.2e3, rb: 6.8e3, c: 220e-9 };
    const dflt = analyzeStage(base);
    const same = analyzeStage({ ...base, controlV: 8 });
    expect(same.periodS).toBeCloseTo(dflt.periodS, 15);
    const half = analyzeStage({ ...base, controlV: 6 });
    expect(half.highS).toBeCloseTo(9e3 * 220e-9 * Math.log((12 - 3) / (12 - 6)), 15);
    expect(half.lowS).toBeCloseTo(6.8e3 * 220e-9 * Math.LN2, 15); // discharge to half of Vctl is always ln 2
  });

  it("diode across RB: charge through RA alone toward Vcc - 0.7 V", () => {
    const a = analyzeStage({
      kind: "timer555-astable",
      supplyV: 9,
      ra: 10e3,
      rb: 10e3,
      c: 1e-6,
      diodeAcrossRb: true,
    });
    expect(a.highS).toBeCloseTo(10e3 * 1e-6 * Math.log((8.3 - 3) / (8.3 - 6)), 12);
    expect(a.lowS).toBeCloseTo(10e3 * 1e-6 * Math.LN2, 12);
  });

  it("control voltage at or above the charge target: no oscillation, error explains it", () => {
    const a = analyzeStage({ kind: "timer555-astable", supplyV: 5, ra: 1e3, rb: 1e3, c: 1e-6, controlV: 5 });
    expect(a.oscillates).toBe(false);
    expect(Number.isNaN(a.periodS)).toBe(true);
    const err = a.checks.find((c) => c.level === "error");
    expect(err?.code).toBe("supply-below-trip");
    expect(err?.message).toMatch(/control voltage/);
  });

  it("warns outside the NE555's 4.5 V to 16 V supply (SLFS022 recommended conditions, from memory)", () => {
    const lo = analyzeStage({ kind: "timer555-astable", supplyV: 3.3, ra: 1e3, rb: 1e3, c: 1e-6 });
    expect(lo.checks.map((c) => c.code)).toContain("supply-range");
    const ok = analyzeStage({ kind: "timer555-astable", supplyV: 12, ra: 1e3, rb: 1e3, c: 1e-6 });
    expect(ok.checks).toEqual([]);
  });
});

describe("555 monostable (TI SLFS022: tw = 1.1 R C)", () => {
  it("pulse width ln 3 R C, within the datasheet's 1.1 to 0.2 %", () => {
    for (const [r, c] of [
      [10e3, 1e-6],
      [1e6, 10e-6],
      [1e3, 1e-9],
    ]) {
      const a = analyzeStage({ kind: "timer555-monostable", r, c });
      expect(rel(a.highS, 1.1 * r * c)).toBeLessThan(0.002);
      expect(a.highS).toBeCloseTo(Math.log(3) * r * c, 15);
      expect(a.periodS).toBe(a.highS);
      expect(a.lowS).toBe(0);
      expect(a.outputSignal).toBe("one-shot");
    }
  });

  it("says it needs a trigger", () => {
    const a = analyzeStage({ kind: "timer555-monostable", r: 100e3, c: 10e-6 });
    expect(a.checks.map((c) => c.code)).toEqual(["needs-trigger"]);
    expect(a.checks[0].message).toMatch(/trigger/);
  });
});
