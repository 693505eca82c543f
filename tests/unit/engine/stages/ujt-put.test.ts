// UJT and PUT relaxation oscillators.
// - Textbook approximation T ~= R C ln(1/(1 - eta)) when Vs >> VD, Vv
//   (Millman & Halkias, Integrated Electronics, UJT section; from memory).
// - Load-line limits (Vs - Vv)/Iv < R < (Vs - Vp)/Ip (General Electric SCR
//   Manual, UJT chapter; from memory).
// - PUT peak point Vp = Vs RB2/(RB1 + RB2) + VAK (ON Semiconductor 2N6027
//   datasheet; from memory).
// Defaults used below are those of the engine contract (engine.md section 4:
// diodeV 0.6 V, valleyV 2 V, Ip 5 uA, Iv 4 mA; common practice / from memory).
import { describe, expect, it } from "vitest";
import { analyzeStage, type UjtStage } from "@/lib/engine";

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe("UJT relaxation oscillator", () => {
  it("approaches R C ln(1/(1 - eta)) as the supply grows (Vs >> VD, Vv)", () => {
    for (const eta of [0.56, 0.63, 0.75]) {
      const approx = (r: number, c: number) => r * c * Math.log(1 / (1 - eta));
      const high = analyzeStage({ kind: "ujt", supplyV: 300, timingR: 470e3, timingC: 100e-9, eta });
      const low = analyzeStage({ kind: "ujt", supplyV: 20, timingR: 47e3, timingC: 1e-6, eta });
      expect(high.oscillates && low.oscillates).toBe(true);
      expect(rel(high.periodS, approx(470e3, 100e-9))).toBeLessThan(0.005);
      // At 20 V the diode drop and valley voltage still matter: the textbook
      // form is only an approximation there (a few percent), and worse than at 300 V.
      const lowErr = rel(low.periodS, approx(47e3, 1e-6));
      expect(lowErr).toBeLessThan(0.05);
      expect(lowErr).toBeGreaterThan(rel(high.periodS, approx(470e3, 100e-9)));
    }
  });

  it("eta = 0.63 gives T ~= R C (textbook rule)", () => {
    const a = analyzeStage({ kind: "ujt", supplyV: 300, timingR: 100e3, timingC: 1e-6, eta: 0.632 });
    expect(rel(a.periodS, 0.1)).toBeLessThan(0.01);
  });

  it("full form: charge from Vv to Vp = eta Vs + VD, discharge through R1 + 5 Ω", () => {
    const s: UjtStage = { kind: "ujt", supplyV: 24, timingR: 33e3, timingC: 220e-9, eta: 0.65 };
    const a = analyzeStage(s);
    const vp = 0.65 * 24 + 0.6;
    expect(a.lowS).toBeCloseTo(33e3 * 220e-9 * Math.log((24 - 2) / (24 - vp)), 15);
    const rd = 47 + 5;
    const vinf = (24 * rd) / (33e3 + rd);
    const tau = (220e-9 * 33e3 * rd) / (33e3 + rd);
    expect(a.highS).toBeCloseTo(tau * Math.log((vp - vinf) / (2 - vinf)), 15);
    expect(a.outputSignal).toBe("pulse-base1");
  });

  it("load line: the timing resistor must lie between (Vs - Vv)/Iv and (Vs - Vp)/Ip", () => {
    const base: UjtStage = { kind: "ujt", supplyV: 20, timingR: 47e3, timingC: 100e-9, eta: 0.6 };
    const rMin = (20 - 2) / 4e-3; // 4.5 kΩ
    const rMax = (20 - (0.6 * 20 + 0.6)) / 5e-6; // 1.48 MΩ
    const latch = analyzeStage({ ...base, timingR: rMin * 0.98 });
    expect(latch.oscillates).toBe(false);
    expect(latch.checks[0]).toMatchObject({ level: "error", code: "load-line-latch", field: "timingR" });
    expect(latch.checks[0].message).toMatch(/latches/);
    expect(latch.checks[0].message).toMatch(/4\.5 kΩ to 1\.48 MΩ/);
    const noFire = analyzeStage({ ...base, timingR: rMax * 1.02 });
    expect(noFire.oscillates).toBe(false);
    expect(noFire.checks[0]).toMatchObject({ level: "error", code: "load-line-no-fire" });
    expect(noFire.checks[0].message).toMatch(/never fires/);
    for (const r of [rMin * 1.02, rMax * 0.98])
      expect(analyzeStage({ ...base, timingR: r }).oscillates).toBe(true);
  });

  it("with RBB, R1, R2: the peak point follows the base divider", () => {
    // Tap voltage = Vs (R1 + eta RBB)/(RBB + R1 + R2) plus VD (voltage divider).
    const s: UjtStage = {
      kind: "ujt",
      supplyV: 15,
      timingR: 10e3,
      timingC: 1e-6,
      eta: 0.56,
      interbaseR: 6.8e3,
      base1R: 100,
      base2R: 330,
    };
    const vp = (15 * (100 + 0.56 * 6.8e3)) / (6.8e3 + 430) + 0.6;
    expect(analyzeStage(s).lowS).toBeCloseTo(10e3 * 1e-6 * Math.log((15 - 2) / (15 - vp)), 15);
  });

  it("supply below the peak point: no oscillation, explained", () => {
    const a = analyzeStage({
      kind: "ujt",
      supplyV: 1.5,
      timingR: 100e3,
      timingC: 1e-6,
      eta: 0.7,
      valleyV: 0.3,
    });
    expect(a.oscillates).toBe(false);
    expect(a.checks[0]).toMatchObject({ level: "error", code: "supply-below-trip" });
    expect(a.checks[0].message).toMatch(/Raise the supply/);
  });
});

describe("PUT relaxation oscillator", () => {
  it("peak point from the gate divider plus VAK, generic relaxation timing", () => {
    const a = analyzeStage({
      kind: "put",
      supplyV: 24,
      timingR: 470e3,
      timingC: 100e-9,
      gateUpperR: 27e3,
      gateLowerR: 15e3,
      dischargeR: 1e3,
    });
    const vp = (24 * 15e3) / 42e3 + 0.7;
    expect(a.lowS).toBeCloseTo(470e3 * 100e-9 * Math.log((24 - 1) / (24 - vp)), 15);
    expect(a.outputSignal).toBe("pulse-cathode");
  });

  it("load line with the default valley current (70 uA): too small a resistor latches", () => {
    const base = { kind: "put" as const, supplyV: 12, timingC: 1e-6, gateUpperR: 10e3, gateLowerR: 10e3 };
    const rMin = (12 - 1) / 70e-6; // 157 kΩ
    expect(analyzeStage({ ...base, timingR: 100e3 }).checks[0].code).toBe("load-line-latch");
    expect(analyzeStage({ ...base, timingR: rMin * 1.05 }).oscillates).toBe(true);
    const rMax = (12 - 6.7) / 2e-6; // 2.65 MΩ
    expect(analyzeStage({ ...base, timingR: rMax * 1.05 }).checks[0].code).toBe("load-line-no-fire");
  });
});

describe("UJT with its peak point below the valley point", () => {
  it("is explained by the threshold order, not by the load line", () => {
    // Vp = eta*Vs + VD = 0.5 * 2.5 V + 0.6 V = 1.85 V (2N2646 data sheet, peak-point
    // voltage), below the 2 V valley default: no negative-resistance region to
    // switch through. The 100 Ω timing resistor is also under the load line's
    // (Vs - Vv)/Iv = 0.5 V / 4 mA = 125 Ω (GE SCR Manual, from memory), but the
    // threshold order is the cause to name (ujt.ts: out-of-order thresholds are
    // left to the relaxation model, which explains them).
    const a = analyzeStage({ kind: "ujt", supplyV: 2.5, timingR: 100, timingC: 1e-6, eta: 0.5 });
    expect(a.oscillates).toBe(false);
    expect(a.checks).toHaveLength(1);
    expect(a.checks[0]).toMatchObject({ level: "error", code: "trip-below-release", field: "eta" });
    expect(a.checks[0].message).toBe(
      "The trip voltage (1.85 V) is not above the release voltage (2 V): the element never switches off and on in turn. Check the device data.",
    );
  });

  it("a peak point equal to the valley point is the same case", () => {
    // valleyV written as the engine's own Vp = eta*Vs + VD, so the two are the same
    // number; Vp = Vv leaves no negative-resistance region either (2N2646 data sheet).
    const a = analyzeStage({
      kind: "ujt",
      supplyV: 2.5,
      timingR: 100,
      timingC: 1e-6,
      eta: 0.5,
      valleyV: 0.5 * 2.5 + 0.6,
    });
    expect(a.oscillates).toBe(false);
    expect(a.checks).toHaveLength(1);
    expect(a.checks[0]).toMatchObject({ level: "error", code: "trip-below-release", field: "eta" });
  });
});
