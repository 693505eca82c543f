// The stage part of the engine contract (engine.md section 4): exported names,
// the nine kinds, field lists for forms and the defaults of the optional fields
// (typical values: common practice or from memory, as the design note says).
import { describe, expect, it } from "vitest";
import * as engine from "@/lib/engine";

describe("stage contract", () => {
  it("exports", () => {
    for (const name of [
      "analyzeStage",
      "validateStage",
      "spreadOf",
      "cornerSpread",
      "monteCarloSpread",
      "parseEng",
      "formatEng",
      "nearestStandardValue",
      "stageWaveform",
    ]) {
      expect(typeof (engine as Record<string, unknown>)[name], name).toBe("function");
    }
  });

  it("nine stage kinds with labels and fields", () => {
    expect(engine.STAGE_KINDS.map((k) => k.kind)).toEqual([
      "threshold",
      "ujt",
      "put",
      "timer555-astable",
      "timer555-monostable",
      "schmitt-rc",
      "opamp-relaxation",
      "transistor-astable",
      "measured",
    ]);
    for (const k of engine.STAGE_KINDS) {
      expect(k.label.length).toBeGreaterThan(3);
      expect(engine.STAGE_FIELDS[k.kind].length).toBeGreaterThan(0);
    }
    expect(engine.STAGE_FIELDS.threshold.map((f) => f.name)).toEqual([
      "supplyV",
      "timingR",
      "timingC",
      "peakV",
      "valleyV",
      "dischargeR",
    ]);
  });

  it("defaults of the optional fields", () => {
    const d = (kind: engine.StageKind) =>
      Object.fromEntries(engine.STAGE_FIELDS[kind].filter((f) => f.optional).map((f) => [f.name, f.default]));
    expect(d("ujt")).toEqual({
      diodeV: 0.6,
      valleyV: 2.0,
      peakCurrentA: 5e-6,
      valleyCurrentA: 4e-3,
      interbaseR: undefined,
      base1R: 47,
      base2R: 470,
    });
    expect(d("put")).toEqual({
      offsetV: 0.7,
      valleyV: 1.0,
      peakCurrentA: 2e-6,
      valleyCurrentA: 70e-6,
      dischargeR: 47,
    });
    expect(d("timer555-astable")).toEqual({ controlV: undefined, diodeAcrossRb: false });
  });

  it("defaults change nothing when written out", () => {
    const bare: engine.Stage = { kind: "ujt", supplyV: 20, timingR: 47e3, timingC: 100e-9, eta: 0.63 };
    const spelled: engine.Stage = {
      ...bare,
      diodeV: 0.6,
      valleyV: 2,
      peakCurrentA: 5e-6,
      valleyCurrentA: 4e-3,
      base1R: 47,
    };
    expect(engine.analyzeStage(spelled).periodS).toBe(engine.analyzeStage(bare).periodS);
  });

  it("the analysis is plain JSON-able data with the contract fields", () => {
    const a = engine.analyzeStage({
      kind: "timer555-astable",
      supplyV: 5,
      ra: 1e3,
      rb: 10e3,
      c: 10e-9,
      tolerances: { c: 0.1 },
    });
    for (const k of [
      "periodS",
      "highS",
      "lowS",
      "frequencyHz",
      "duty",
      "outputSignal",
      "checks",
      "oscillates",
    ]) {
      expect(a).toHaveProperty(k);
    }
    const back = JSON.parse(JSON.stringify(a));
    expect(back.spread.corners.periodS.min).toBeLessThan(a.periodS);
    expect(back.spread.monteCarlo.histogram.counts).toHaveLength(40);
  });
});

describe("stage kinds for forms", () => {
  it("each kind lists its fields with units, and the output it makes", () => {
    for (const k of engine.STAGE_KINDS) {
      expect(k.fields).toBe(engine.STAGE_FIELDS[k.kind]);
      for (const f of k.fields) expect(["Ω", "F", "V", "A", "s", "", "bool"]).toContain(f.unit);
    }
    const ujt = engine.STAGE_KINDS.find((k) => k.kind === "ujt")!;
    expect(ujt.outputSignal).toBe("pulse-base1");
    expect(ujt.fields.find((f) => f.name === "timingC")).toMatchObject({ unit: "F", optional: false });
  });
});
