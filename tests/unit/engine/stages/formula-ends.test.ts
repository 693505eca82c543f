// Ends of the stage formulas: the 555 one-shot's charge sketch, the
// transistor astable's output label against its R1·C1 half, and the top of
// the synchronised stage's timing-resistor search range.
import { describe, expect, it } from "vitest";
import { firingDelay, timingRForDelay } from "@/lib/engine/stages/sync";
import { timer555MonostableModel } from "@/lib/engine/stages/timer555-monostable";
import { transistorAstableModel } from "@/lib/engine/stages/transistor-astable";

describe("555 monostable charge sketch", () => {
  it("charges through R·C for t = ln3·R·C, about 1.1 R C, reaching 2/3 Vcc", () => {
    const s = { kind: "timer555-monostable" as const, r: 100e3, c: 10e-6 };
    const r = timer555MonostableModel.evaluate(s);
    const sketch = timer555MonostableModel.segments!(s, r);
    if (sketch === null) throw new Error("the one-shot has no charge sketch");
    const charge = sketch.segments[0];
    // TI NE555 datasheet (SLFS022), monostable operation: tw = 1.1 R C, C charged from 0 to 2/3 Vcc.
    expect(charge.tauS).toBeCloseTo(s.r * s.c, 12);
    expect(charge.durationS / (s.r * s.c)).toBeCloseTo(1.1, 1);
    expect(1 - Math.exp(-charge.durationS / charge.tauS)).toBeCloseTo(2 / 3, 9);
    expect(charge.out).toBe(1);
    expect(sketch.segments[1].out).toBe(0);
  });
});

describe("transistor astable output label", () => {
  it("names the R1·C1 half as the high time, which evaluate gives", () => {
    const s = {
      kind: "transistor-astable" as const,
      supplyV: 100,
      r1: 47e3,
      c1: 10e-9,
      r2: 10e3,
      c2: 100e-9,
    };
    const r = transistorAstableModel.evaluate(s);
    expect(transistorAstableModel.outputLabel).toMatch(/Q1's collector/);
    expect(transistorAstableModel.outputLabel).toMatch(/R1·C1/);
    // engine.md section 1 (Millman & Halkias, Integrated Electronics, multivibrator chapter,
    // from memory): t1 ~= ln2·R1·C1 when Vcc >> VBE; the R1·C1 half is the high one.
    expect(r.highS / (Math.LN2 * s.r1 * s.c1)).toBeCloseTo(1, 2);
    expect(r.highS).not.toBeCloseTo(Math.LN2 * s.r2 * s.c2, 6);
  });
});

describe("timing resistor search range for a synchronised stage", () => {
  it("includes 1 GΩ itself: the delay 1 GΩ gives is found, not refused", () => {
    // The product's own documented range (timingRForDelay / suggestTimingR): 1 Ω to 1 GΩ, ends included.
    const x = { mainsHz: 50, mainsVrms: 230, clampV: 20, c: 1e-12, peakV: 0.63 * 20 + 0.6 };
    const d = firingDelay({ ...x, r: 1e9 });
    expect(d).not.toBeNull();
    const r = timingRForDelay(x, d!);
    expect(r).not.toBeNull();
    expect(r! / 1e9).toBeCloseTo(1, 3);
  });
});
