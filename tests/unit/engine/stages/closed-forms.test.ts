// Schmitt-trigger RC, op-amp relaxation, two-transistor astable and measured
// stages against their standard closed forms.
import { describe, expect, it } from "vitest";
import { analyzeStage } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe("Schmitt-trigger inverter RC oscillator (first-order RC step response)", () => {
  it("tH = R C ln((VDD - VT-)/(VDD - VT+)), tL = R C ln(VT+/VT-)", () => {
    // Thresholds of a 74HC14 at VDD = 5 V, typical (about 2.7 V / 1.6 V; from memory).
    const a = analyzeStage({ kind: "schmitt-rc", supplyV: 5, r: 100e3, c: 10e-9, vtPlus: 2.7, vtMinus: 1.6 });
    expect(a.highS).toBeCloseTo(1e-3 * Math.log(3.4 / 2.3), 15);
    expect(a.lowS).toBeCloseTo(1e-3 * Math.log(2.7 / 1.6), 15);
    expect(a.outputSignal).toBe("rect-output");
  });

  it("thresholds symmetric about VDD/2 give 50 % duty", () => {
    const a = analyzeStage({ kind: "schmitt-rc", supplyV: 10, r: 10e3, c: 1e-6, vtPlus: 6.5, vtMinus: 3.5 });
    expect(a.duty).toBeCloseTo(0.5, 12);
  });

  it("VT+ at or above the supply: never switches, explained; reversed thresholds: input error", () => {
    const a = analyzeStage({ kind: "schmitt-rc", supplyV: 2.5, r: 10e3, c: 1e-6, vtPlus: 2.6, vtMinus: 1 });
    expect(a.oscillates).toBe(false);
    expect(a.checks[0]).toMatchObject({ level: "error", code: "supply-below-trip", field: "supplyV" });
    // The input charges toward the supply, so it never reaches VT+ above it (our text, checked whole).
    expect(a.checks[0].message).toBe(
      "The input can rise at most to the supply (2.5 V), which does not exceed VT+ (2.6 V): the gate never switches. Check the supply and the thresholds for that supply.",
    );
    expectEngineError(
      () => analyzeStage({ kind: "schmitt-rc", supplyV: 5, r: 10e3, c: 1e-6, vtPlus: 1.6, vtMinus: 2.7 }),
      "invalid-stage",
      "vtPlus",
    );
  });
  it("VT+ equal to the supply: never switches (tH = R C ln((VDD - VT-)/0) is unbounded)", () => {
    // First-order RC step response: the input approaches VDD only as t -> infinity,
    // so a VT+ of exactly VDD is never reached; "does not exceed" covers equality.
    const a = analyzeStage({ kind: "schmitt-rc", supplyV: 2.5, r: 10e3, c: 1e-6, vtPlus: 2.5, vtMinus: 1 });
    expect(a.oscillates).toBe(false);
    expect(a.checks[0]).toMatchObject({ level: "error", code: "supply-below-trip", field: "supplyV" });
    expect(a.checks[0].message).toBe(
      "The input can rise at most to the supply (2.5 V), which does not exceed VT+ (2.5 V): the gate never switches. Check the supply and the thresholds for that supply.",
    );
  });
});

describe("op-amp relaxation oscillator (Sedra & Smith, astable multivibrator; from memory)", () => {
  it("T = 2 R C ln((1 + beta)/(1 - beta)), 50 % duty", () => {
    const a = analyzeStage({
      kind: "opamp-relaxation",
      r: 10e3,
      c: 100e-9,
      feedbackR1: 10e3,
      feedbackR2: 10e3,
    });
    // beta = 0.5 -> T = 2 R C ln 3
    expect(a.periodS).toBeCloseTo(2e-3 * Math.log(3), 15);
    expect(a.duty).toBe(0.5);
    expect(a.outputSignal).toBe("square-bipolar");
  });

  it("beta = 0.462 gives T ~= 2 R C (common practice, no source)", () => {
    // R2/(R1 + R2) = 0.462 with R1 = 11.64 k, R2 = 10 k
    const a = analyzeStage({
      kind: "opamp-relaxation",
      r: 47e3,
      c: 1e-6,
      feedbackR1: 11.645e3,
      feedbackR2: 10e3,
    });
    expect(rel(a.periodS, 2 * 47e-3)).toBeLessThan(0.001);
  });
});

describe("two-transistor astable (Millman & Halkias, multivibrators; from memory)", () => {
  it("exact form R C ln((2 Vcc - VBE - VCEsat)/(Vcc - VBE)) with VBE 0.65 V, VCEsat 0.1 V", () => {
    const a = analyzeStage({
      kind: "transistor-astable",
      supplyV: 5,
      r1: 47e3,
      c1: 10e-6,
      r2: 22e3,
      c2: 10e-6,
    });
    expect(a.highS).toBeCloseTo(0.47 * Math.log((10 - 0.75) / 4.35), 12);
    expect(a.lowS).toBeCloseTo(0.22 * Math.log((10 - 0.75) / 4.35), 12);
  });

  it("C1 and C2 are capacitances: above 10 mF it is flagged, above 100 F refused (common practice, no source)", () => {
    const base = {
      kind: "transistor-astable",
      supplyV: 5,
      r1: 47e3,
      c1: 10e-6,
      r2: 22e3,
      c2: 10e-6,
    } as const;
    expect(analyzeStage({ ...base, c1: 22e-3 }).checks).toEqual([
      {
        level: "warning",
        code: "value-range",
        field: "c1",
        message:
          "Coupling capacitor C1 (to Q1 base) 22 mF is above 10 mF: leakage currents may set the timing more than the formula does. Measure the old stage.",
      },
    ]);
    const err = expectEngineError(() => analyzeStage({ ...base, c1: 200 }), "invalid-stage", "c1");
    expect(err.message).toBe("c1 = 200 F is out of physical range.");
    // C2 the same
    expect(analyzeStage({ ...base, c2: 22e-3 }).checks).toEqual([
      {
        level: "warning",
        code: "value-range",
        field: "c2",
        message:
          "Coupling capacitor C2 (to Q2 base) 22 mF is above 10 mF: leakage currents may set the timing more than the formula does. Measure the old stage.",
      },
    ]);
    const err2 = expectEngineError(() => analyzeStage({ ...base, c2: 200 }), "invalid-stage", "c2");
    expect(err2.message).toBe("c2 = 200 F is out of physical range.");
  });

  it("tends to ln 2 R C when Vcc >> VBE", () => {
    const a = analyzeStage({
      kind: "transistor-astable",
      supplyV: 1000,
      r1: 10e3,
      c1: 1e-6,
      r2: 10e3,
      c2: 1e-6,
    });
    expect(rel(a.highS, Math.LN2 * 10e-3)).toBeLessThan(0.001);
    // The base swings far beyond a 5 V base-emitter rating: warned.
    expect(a.checks.map((c) => c.code)).toContain("base-reverse-voltage");
  });

  it("supply below VBE cannot start", () => {
    const a = analyzeStage({
      kind: "transistor-astable",
      supplyV: 0.5,
      r1: 10e3,
      c1: 1e-6,
      r2: 10e3,
      c2: 1e-6,
    });
    expect(a.oscillates).toBe(false);
    expect(a.checks[0].code).toBe("supply-below-trip");
  });
});

describe("measured stage (IEEE 181 terms: period, pulse duration)", () => {
  it("passes period and high time through", () => {
    const a = analyzeStage({ kind: "measured", periodS: 20e-3, highS: 1.5e-3 });
    expect(a.periodS).toBe(20e-3);
    expect(a.highS).toBe(1.5e-3);
    expect(a.lowS).toBeCloseTo(18.5e-3, 15);
    expect(a.frequencyHz).toBeCloseTo(50, 12);
    expect(a.duty).toBeCloseTo(0.075, 12);
  });

  it("a high time not shorter than the period is an input error naming highS", () => {
    expectEngineError(
      () => analyzeStage({ kind: "measured", periodS: 1e-3, highS: 1e-3 }),
      "invalid-stage",
      "highS",
    );
  });
});
