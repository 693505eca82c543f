// Waveform sketch: the capacitor voltage must pass through the model's own
// thresholds at the phase boundaries (555: Vcc/3 and 2Vcc/3, TI SLFS022;
// Schmitt: VT- and VT+), and the output must follow the charge phase.
import { describe, expect, it } from "vitest";
import { analyzeStage, stageWaveform, type Stage } from "@/lib/engine";

/** Share of the sketched time the output is high, each point holding until the next. */
function highShare(w: { tS: number; out: number }[]): number {
  let high = 0;
  for (let i = 0; i + 1 < w.length; i++) if (w[i].out === 1) high += w[i + 1].tS - w[i].tS;
  return high / (w[w.length - 1].tS - w[0].tS);
}

function sampleAt(stage: Stage, points: number) {
  return stageWaveform(stage, analyzeStage(stage), points);
}

describe("stageWaveform", () => {
  it("555 astable: starts at Vcc/3, reaches 2Vcc/3 at the end of the high time, two periods", () => {
    const s: Stage = { kind: "timer555-astable", supplyV: 9, ra: 10e3, rb: 10e3, c: 1e-6 };
    const a = analyzeStage(s);
    const w = stageWaveform(s, a, 401);
    // Event-based: the even points plus every edge, never fewer than asked.
    expect(w.length).toBeGreaterThanOrEqual(401);
    expect(w[0]).toMatchObject({ tS: 0, out: 1 });
    expect(w[0].capV).toBeCloseTo(3, 12);
    expect(w[w.length - 1].tS).toBeCloseTo(2 * a.periodS, 15);
    const max = Math.max(...w.map((p) => p.capV));
    const min = Math.min(...w.map((p) => p.capV));
    expect(max).toBeLessThanOrEqual(6 + 1e-9);
    expect(max).toBeGreaterThan(5.95);
    expect(min).toBeGreaterThanOrEqual(3 - 1e-9);
    // output high share of the time ~ duty (points are not evenly spaced)
    expect(Math.abs(highShare(w) - a.duty)).toBeLessThan(0.01);
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

// Issue 18 point 5: the sketch is built from the edges, so a narrow pulse is
// drawn. A 16.7 us pulse every 50 ms (duty 334 ppm; the numbers are ours).
// Planted fault kept as a case: the old even grid of 800 points (one per
// 125 us over two periods) steps over the pulse entirely.
describe("event-based waveform", () => {
  const narrow: Stage = { kind: "measured", periodS: 50e-3, highS: 16.7e-6 };

  it("draws both 16.7 us pulses of two 50 ms periods with their true width", () => {
    const w = sampleAt(narrow, 800);
    const rises =
      w.filter((p, i) => i > 0 && p.out === 1 && w[i - 1].out === 0).length + (w[0].out === 1 ? 1 : 0);
    expect(rises).toBe(2);
    expect(highShare(w) * 2 * 50e-3).toBeCloseTo(2 * 16.7e-6, 9);
    // Upright edges: a point just before each fall is still high.
    const fall = w.findIndex((p, i) => i > 0 && p.out === 0 && w[i - 1].out === 1);
    expect(w[fall].tS - w[fall - 1].tS).toBeLessThan(1e-7);
  });

  it("draws the fall upright at the scale of the pulse itself", () => {
    // The last high point sits just before the fall (waveform.ts: "the instant
    // just before it, so a step draws upright"): within a thousandth of the
    // 16.7 us pulse, not a fixed share of the 50 ms period (common practice, no source).
    const w = sampleAt(narrow, 800);
    const fall = w.findIndex((p, i) => i > 0 && p.out === 0 && w[i - 1].out === 1);
    expect(w[fall].tS).toBeCloseTo(16.7e-6, 15);
    expect(w[fall].tS - w[fall - 1].tS).toBeLessThan(16.7e-6 / 1000);
  });

  it("planted fault: an even 800-point grid misses the pulse", () => {
    const even = Array.from({ length: 800 }, (_, i) => {
      const tS = (2 * 50e-3 * (i + 0.5)) / 800; // any grid phase off the edge
      return { tS, out: tS % 50e-3 < 16.7e-6 ? 1 : 0 };
    });
    expect(even.some((p) => p.out === 1)).toBe(false);
  });

  it("a UJT's short discharge pulse keeps its falling capacitor shape", () => {
    // Textbook UJT relaxation oscillator: discharge through B1 (tau = R_B1 * C) is short against the charge.
    const s: Stage = { kind: "ujt", supplyV: 20, timingR: 470e3, timingC: 1e-6, eta: 0.6, base1R: 47 };
    const a = analyzeStage(s);
    const w = stageWaveform(s, a, 400);
    const pulse = w.filter((p) => p.out === 1);
    expect(pulse.length).toBeGreaterThanOrEqual(2 * 8);
    expect(highShare(w) * 2 * a.periodS).toBeCloseTo(2 * a.highS, 9);
  });
});
