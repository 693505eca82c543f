// Field units are product text: the form prints them and the value reader takes an
// engineering suffix against them (engine.md section 4, field lists for forms). Typed here per
// field name from the quantity it holds, in SI units (BIPM SI Brochure, 9th edition: V, Ω, F,
// A, s), not read from the stage files. eta is the UJT's intrinsic standoff ratio, a plain
// ratio with no unit (2N2646 datasheet, "intrinsic standoff ratio"); diodeAcrossRb is a yes/no
// choice.
import { describe, expect, it } from "vitest";
import * as engine from "@/lib/engine";

const UNIT_OF: Record<string, string> = {
  supplyV: "V",
  controlV: "V",
  diodeV: "V",
  offsetV: "V",
  peakV: "V",
  valleyV: "V",
  vtPlus: "V",
  vtMinus: "V",
  r: "Ω",
  r1: "Ω",
  r2: "Ω",
  ra: "Ω",
  rb: "Ω",
  timingR: "Ω",
  base1R: "Ω",
  base2R: "Ω",
  interbaseR: "Ω",
  dischargeR: "Ω",
  feedbackR1: "Ω",
  feedbackR2: "Ω",
  gateUpperR: "Ω",
  gateLowerR: "Ω",
  c: "F",
  c1: "F",
  c2: "F",
  timingC: "F",
  peakCurrentA: "A",
  valleyCurrentA: "A",
  periodS: "s",
  highS: "s",
  eta: "",
  diodeAcrossRb: "bool",
};

describe("stage field units", () => {
  for (const k of engine.STAGE_KINDS)
    it(`${k.kind}: every field's unit is the SI unit of its quantity`, () => {
      const fields = engine.STAGE_FIELDS[k.kind];
      expect(fields.length).toBeGreaterThan(0);
      for (const f of fields) {
        expect(Object.keys(UNIT_OF), `${k.kind}.${f.name} has no unit typed in this test`).toContain(f.name);
        expect(f.unit, `${k.kind}.${f.name}`).toBe(UNIT_OF[f.name]);
      }
    });

  it("the UJT's valley and peak points are voltages and currents", () => {
    const unit = (name: string) => engine.STAGE_FIELDS.ujt.find((f) => f.name === name)?.unit;
    expect([unit("valleyV"), unit("valleyCurrentA"), unit("peakCurrentA"), unit("eta")]).toEqual([
      "V",
      "A",
      "A",
      "",
    ]);
  });
});
