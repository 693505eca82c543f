// A field whose range is "not negative" takes 0 (analyze-stage.ts: the product's
// refusal reads "must not be negative"): the PUT's anode-gate offset VAK of 0 V
// puts the peak point at the gate divider's voltage, Vp = Vs·RL/(RU + RL) + VAK
// (programmable UJT peak point, 2N6027 datasheet, from memory).
import { describe, expect, it } from "vitest";
import { analyzeStage, type Stage } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

describe("not-negative fields", () => {
  it("PUT offsetV 0 is taken, a negative offsetV refused with the product's text", () => {
    // Our own demo values.
    const put = {
      kind: "put",
      supplyV: 24,
      timingR: 470e3,
      timingC: 100e-9,
      gateUpperR: 27e3,
      gateLowerR: 15e3,
    };
    const a = analyzeStage({ ...put, offsetV: 0 } as Stage);
    expect(a.oscillates).toBe(true);
    const withOffset = analyzeStage({ ...put, offsetV: 0.7 } as Stage);
    // A lower peak point is reached sooner on the same RC charge: the period shortens.
    expect(a.periodS).toBeLessThan(withOffset.periodS);
    const err = expectEngineError(
      () => analyzeStage({ ...put, offsetV: -0.1 } as Stage),
      "invalid-stage",
      "offsetV",
    );
    expect(err.message).toBe("offsetV must not be negative (Anode-gate offset VAK).");
  });
});
