// Waveform sketch: the capacitor voltage must pass through the model's own
// thresholds at the phase boundaries (555: Vcc/3 and 2Vcc/3, TI SLFS022;
// Schmitt: VT- and VT+), and the output must follow the charge phase.
import { describe, expect, it } from "vitest";
import { analyzeStage, stageWaveform, type Stage } from "@/lib/engine";

function sampleAt(stage: Stage, points: number) {
  return stageWaveform(stage, analyzeStage(stage), points);
}

describe("stageWaveform", () => {
  it("555 astable: starts at Vcc/3, reaches 2Vcc/3 at the end of the high time, two periods", () => {
    const s: Stage = { kind: "timer555-astable", supplyV: 9, ra: 10e3, rb: 10e3, c: 1e-6 };
    const a = analyzeStage(s);
    const w = stageWaveform(s, a, 401);
    expect(w).toHaveLength(401);
    expect(w[0]).toMatchObject({ tS: 0, out: 1 });
    expect(w[0].capV).toBeCloseTo(3, 12);
    expect(w[400].tS).toBeCloseTo(2 * a.periodS, 15);
    const max = Math.max(...w.map((p) => p.capV));
    const min = Math.min(...w.map((p) => p.capV));
    expect(max).toBeLessThanOrEqual(6 + 1e-9);
    expect(max).toBeGreaterThan(5.95);
    expect(min).toBeGreaterThanOrEqual(3 - 1e-9);
    // output high share of the samples ~ duty
    const high = w.filter((p) => p.out === 1).length / w.length;
    expect(Math.abs(high - a.duty)).toBeLessThan(0.01);
  });

  it("Schmitt RC stays between VT- and VT+", () => {
    const w = sampleAt({ kind: "schmitt-rc", supplyV: 5, r: 10e3, c: 1e-6, vtPlus: 2.9, vtMinus: 1.4 }, 1000);
    for (const p of w) {
      expect(p.capV).toBeGreaterThanOrEqual(1.4 - 1e-9);
      expect(p.capV).toBeLessThanOrEqual(2.9 + 1e-9);
    }
  });

  it("UJT: output pulse while the capacitor falls from the peak point", () => {
    const s: Stage = { kind: "ujt", supplyV: 20, timingR: 10e3, timingC: 1e-6, eta: 0.6, base1R: 1e3 };
    const w = sampleAt(s, 2000);
    const pulse = w.filter((p) => p.out === 1);
    expect(pulse.length).toBeGreaterThan(0);
    for (let i = 1; i < w.length; i++)
      if (w[i].out === 1 && w[i - 1].out === 1) expect(w[i].capV).toBeLessThan(w[i - 1].capV);
    expect(Math.max(...w.map((p) => p.capV))).toBeLessThanOrEqual(0.6 * 20 + 0.6 + 1e-9);
  });

  it("measured stage: output only, no capacitor; a stage that does not run: no points", () => {
    const w = sampleAt({ kind: "measured", periodS: 10e-3, highS: 2.5e-3 }, 101);
    expect(w.every((p) => Number.isNaN(p.capV))).toBe(true);
    expect(w.filter((p) => p.out === 1).length).toBeGreaterThan(20);
    const dead: Stage = {
      kind: "threshold",
      supplyV: 5,
      timingR: 1e3,
      timingC: 1e-6,
      peakV: 8,
      valleyV: 2,
      dischargeR: 10,
    };
    expect(sampleAt(dead, 100)).toEqual([]);
  });
});
