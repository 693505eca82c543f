// Bad stage input gives EngineError("invalid-stage") naming the field, never a
// wrong number: missing, negative, zero, NaN, Infinity, wrong type, reversed
// thresholds, malformed tolerances.
import { describe, expect, it } from "vitest";
import { analyzeStage, STAGE_FIELDS, STAGE_KINDS, validateStage, type Stage } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

const valid: Stage[] = [
  { kind: "threshold", supplyV: 12, timingR: 47e3, timingC: 1e-6, peakV: 8, valleyV: 2, dischargeR: 100 },
  { kind: "ujt", supplyV: 20, timingR: 47e3, timingC: 100e-9, eta: 0.63 },
  { kind: "put", supplyV: 24, timingR: 470e3, timingC: 100e-9, gateUpperR: 27e3, gateLowerR: 15e3 },
  { kind: "timer555-astable", supplyV: 9, ra: 1e3, rb: 10e3, c: 10e-9 },
  { kind: "timer555-monostable", r: 10e3, c: 1e-6 },
  { kind: "schmitt-rc", supplyV: 5, r: 100e3, c: 10e-9, vtPlus: 2.7, vtMinus: 1.6 },
  { kind: "opamp-relaxation", r: 10e3, c: 100e-9, feedbackR1: 10e3, feedbackR2: 10e3 },
  { kind: "transistor-astable", supplyV: 5, r1: 47e3, c1: 10e-6, r2: 47e3, c2: 10e-6 },
  { kind: "measured", periodS: 20e-3, highS: 1e-3 },
];

describe("stage validation", () => {
  it("every kind has a valid example here, and each analyses", () => {
    expect(valid.map((s) => s.kind).sort()).toEqual(STAGE_KINDS.map((k) => k.kind).sort());
    for (const s of valid) expect(analyzeStage(s).oscillates).toBe(true);
  });

  for (const stage of valid) {
    const required = STAGE_FIELDS[stage.kind].filter((f) => !f.optional);
    it(`${stage.kind}: each required field missing, negative, zero, NaN or infinite is refused by name`, () => {
      for (const f of required) {
        const without = { ...stage } as Record<string, unknown>;
        delete without[f.name];
        expectEngineError(() => analyzeStage(without as unknown as Stage), "invalid-stage", f.name);
        const bad: unknown[] = [-1, NaN, Infinity, -Infinity, "12", null];
        if (f.range !== "nonNegative") bad.push(0);
        for (const v of bad) {
          expectEngineError(() => analyzeStage({ ...stage, [f.name]: v } as Stage), "invalid-stage", f.name);
        }
      }
    });
  }

  it("optional fields are checked when given", () => {
    const ujt = valid[1];
    expectEngineError(() => analyzeStage({ ...ujt, diodeV: -0.6 } as Stage), "invalid-stage", "diodeV");
    expectEngineError(() => analyzeStage({ ...ujt, interbaseR: 0 } as Stage), "invalid-stage", "interbaseR");
    const t555 = valid[3];
    expectEngineError(
      () => analyzeStage({ ...t555, diodeAcrossRb: "yes" } as unknown as Stage),
      "invalid-stage",
      "diodeAcrossRb",
    );
  });

  it("eta must be strictly between 0 and 1", () => {
    for (const eta of [0, 1, 1.2]) {
      expectEngineError(() => analyzeStage({ ...valid[1], eta } as Stage), "invalid-stage", "eta");
    }
  });

  it("unknown kind and non-objects name the kind field", () => {
    expectEngineError(() => validateStage({ kind: "neon" }), "invalid-stage", "kind");
    expectEngineError(() => validateStage(null), "invalid-stage", "kind");
  });

  it("absurd magnitudes are out of physical range", () => {
    expectEngineError(() => analyzeStage({ ...valid[4], c: 1e6 } as Stage), "invalid-stage", "c");
  });

  it("tolerances: unknown field, negative, >= 100 % minus, wrong shape", () => {
    const s = valid[3];
    const cases: [unknown, string][] = [
      [{ foo: 0.05 }, "tolerances.foo"],
      [{ ra: -0.05 }, "tolerances.ra"],
      [{ ra: 1 }, "tolerances.ra"],
      [{ c: [0.2] }, "tolerances.c"],
      [{ c: [0.2, NaN] }, "tolerances.c"],
      [{ diodeAcrossRb: 0.1 }, "tolerances.diodeAcrossRb"],
      [{ controlV: 0.05 }, "tolerances.controlV"], // no controlV value to vary
    ];
    for (const [tolerances, field] of cases) {
      expectEngineError(() => analyzeStage({ ...s, tolerances } as Stage), "invalid-stage", field);
    }
  });

  it("tolerances: an uneven [minus, plus] pair, the plus side checked on its own", () => {
    const s = valid[3];
    // IEC 60062 tolerance letter Z is -20 % / +80 % (wide-tolerance capacitors): a valid pair.
    expect(() => analyzeStage({ ...s, tolerances: { c: [0.2, 0.8] } } as Stage)).not.toThrow();
    // The engine's own bounds on the plus side: 0 to 10 (+1000 %), the ends included.
    expect(() => analyzeStage({ ...s, tolerances: { c: [0.2, 10] } } as Stage)).not.toThrow();
    for (const plus of [10.5, -0.1]) {
      const err = expectEngineError(
        () => analyzeStage({ ...s, tolerances: { c: [0.2, plus] } } as Stage),
        "invalid-stage",
        "tolerances.c",
      );
      expect(err.message).toBe("tolerances.c: the plus tolerance must be from 0 to 10.");
    }
  });
});
