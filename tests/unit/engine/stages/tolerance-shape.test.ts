// The shape of a stage's tolerances (engine.md section 1, stage input: `tolerances:
// { <field>: number | [minus, plus] }`, relative): anything else is refused on the
// `tolerances` field itself, a one-sided pair (plus side 0) is a valid pair, and
// a tolerance needs a value (given or the field's default) to vary.
import { describe, expect, it } from "vitest";
import { analyzeStage, type Stage } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

// NE555 astable example values (our own demo numbers).
function astable(tolerances: unknown): Stage {
  return {
    kind: "timer555-astable",
    supplyV: 9,
    ra: 1e3,
    rb: 10e3,
    c: 10e-9,
    tolerances,
  } as unknown as Stage;
}

describe("stage tolerances: shape", () => {
  it("a list, null or a string is not an object of field: tolerance, refused by the tolerances field", () => {
    // engine.md section 1: tolerances is an object keyed by field name; the product's own message.
    for (const tolerances of [[0.05], [], null, "5 %"]) {
      const err = expectEngineError(() => analyzeStage(astable(tolerances)), "invalid-stage", "tolerances");
      expect(err.message).toBe("tolerances must be an object of field: relative tolerance.");
    }
  });

  it("a pair whose plus side is 0 (one-sided, -5 % / +0 %) is taken, and the corners never exceed the nominal", () => {
    // engine.md section 1: [minus, plus] relative; the engine's own plus bounds are 0 to 10, the ends included.
    const a = analyzeStage(astable({ c: [0.05, 0] }));
    expect(a.spread).toBeDefined();
    // NE555 datasheet (TI SLFS022): f = 1.44 / ((RA + 2 RB) C), so the period rises with C: with C only
    // allowed to fall, the longest corner period is the nominal one.
    expect(a.spread!.corners.periodS.max).toBeCloseTo(a.periodS, 15);
    expect(a.spread!.corners.periodS.min).toBeLessThan(a.periodS);
  });

  it("a tolerance on an optional field with neither a value nor a default is refused with the product's text", () => {
    // engine.md section 1: the 555's controlV (pin 5) defaults to 2/3 supplyV in the model, so it has
    // no stored default value to vary; a tolerance on it needs the value given.
    const err = expectEngineError(
      () => analyzeStage(astable({ controlV: 0.05 })),
      "invalid-stage",
      "tolerances.controlV",
    );
    expect(err.message).toBe("A tolerance on controlV needs a value for controlV.");
    const given = { ...(astable({ controlV: 0.05 }) as object), controlV: 6 } as Stage;
    expect(analyzeStage(given).spread).toBeDefined();
  });
});
