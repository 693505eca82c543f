// Generic threshold stage: first-order RC charge and discharge (any circuit
// analysis textbook, e.g. Hayt & Kemmerly, first-order circuits):
// tc = R C ln((Vs - Vv)/(Vs - Vp)); discharge toward Vinf = Vs Rd/(R + Rd) with
// tau = C (R || Rd). ngspice agreement is in ngspice-stages.test.ts.
import { describe, expect, it } from "vitest";
import { analyzeStage, type ThresholdStage } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

const neon: ThresholdStage = {
  kind: "threshold",
  supplyV: 150,
  timingR: 1e6,
  timingC: 100e-9,
  peakV: 90, // striking voltage
  valleyV: 60, // extinction voltage
  dischargeR: 10e3,
};

describe("threshold stage", () => {
  it("charge time R C ln((Vs - Vv)/(Vs - Vp))", () => {
    const a = analyzeStage(neon);
    expect(a.lowS).toBeCloseTo(0.1 * Math.log(90 / 60), 15);
    expect(a.periodS).toBeCloseTo(a.highS + a.lowS, 15);
    expect(a.frequencyHz).toBeCloseTo(1 / a.periodS, 9);
    expect(a.outputSignal).toBe("pulse-discharge");
  });

  it("trip at half the supply from near 0 V: charge time close to ln 2 R C, tiny pulse with a 1 Ω discharge", () => {
    const a = analyzeStage({ ...neon, supplyV: 100, peakV: 50, valleyV: 0.5, dischargeR: 1 });
    expect(a.lowS).toBeCloseTo(0.1 * Math.log(99.5 / 50), 15);
    expect(a.highS).toBeLessThan(1e-6);
  });

  it("latch-up when the discharge settles above the release voltage", () => {
    // Vinf = 150 * 1M/(1M + 1M) = 75 V > 60 V
    const a = analyzeStage({ ...neon, dischargeR: 1e6 });
    expect(a.oscillates).toBe(false);
    expect(a.checks[0]).toMatchObject({ level: "error", code: "latches" });
    expect(a.checks[0].message).toMatch(/75 V/);
    expect(Number.isNaN(a.frequencyHz)).toBe(true);
  });

  it("supply at or below the trip voltage never fires", () => {
    const a = analyzeStage({ ...neon, supplyV: 85 });
    expect(a.oscillates).toBe(false);
    expect(a.checks[0]).toMatchObject({ level: "error", code: "supply-below-trip", field: "supplyV" });
  });

  it("a supply equal to the trip voltage never fires either", () => {
    // The charge toward Vs reaches Vp = Vs only as t -> infinity: R C ln((Vs - Vv)/(Vs - Vp))
    // has a zero in its denominator (first-order charge, header). The product's own message.
    const a = analyzeStage({ ...neon, supplyV: 90 });
    expect(a.oscillates).toBe(false);
    expect(a.checks).toHaveLength(1);
    expect(a.checks[0]).toMatchObject({ level: "error", code: "supply-below-trip", field: "supplyV" });
    expect(a.checks[0].message).toBe(
      "The capacitor can charge at most to the supply (90 V), which does not exceed the trip voltage (90 V): the stage never fires. Raise the supply or lower the trip voltage.",
    );
  });

  it("reversed thresholds are an input error naming peakV", () => {
    expectEngineError(() => analyzeStage({ ...neon, peakV: 50 }), "invalid-stage", "peakV");
    expectEngineError(() => analyzeStage({ ...neon, peakV: 60 }), "invalid-stage", "peakV");
  });
});

describe("unusual values", () => {
  it("a timing resistor above 22 MΩ is flagged (leakage; common practice, no source)", () => {
    const a = analyzeStage({ ...neon, timingR: 47e6, dischargeR: 10e3 });
    expect(a.checks.find((c) => c.code === "value-range")).toMatchObject({
      level: "warning",
      field: "timingR",
    });
    expect(analyzeStage(neon).checks).toEqual([]);
  });

  it("22 MΩ itself is not flagged, anything above it is, and the warning says what to do", () => {
    // The 22 MΩ line is common practice, no source; the boundary and the text are ours.
    expect(analyzeStage({ ...neon, timingR: 22e6 }).checks).toEqual([]);
    expect(analyzeStage({ ...neon, timingR: 22.1e6 }).checks).toEqual([
      {
        level: "warning",
        code: "value-range",
        field: "timingR",
        message:
          "Timing resistor 22.1 MΩ is above 22 MΩ: leakage currents may set the timing more than the formula does. Measure the old stage.",
      },
    ]);
  });
});
