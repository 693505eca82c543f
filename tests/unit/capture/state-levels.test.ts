// State levels by the histogram method (IEEE Std 181-2011, 5.2.1.1: the
// histogram of the waveform's amplitude is split at the middle of its range
// and each state level is the mode of its half). The expected levels are
// worked out here from that definition on traces built sample by sample.
import { describe, expect, it } from "vitest";
import { binCount, histogramStateLevels } from "@/lib/capture/state-levels";

const trace = (...parts: [value: number, count: number][]) =>
  Float64Array.from(parts.flatMap(([v, n]) => Array<number>(n).fill(v)));

describe("binCount (about sqrt(n) bins, even, 16..1024: common practice, no source)", () => {
  it.each([
    [1, 16],
    [100, 16], // sqrt 10 -> 10, raised to the floor of 16
    [1000, 32], // sqrt 31.6 -> 32
    [2000, 44], // sqrt 44.7 -> 44 (nearest even)
    [10_000, 100],
    [1e7, 1024], // sqrt 3162 -> capped at 1024
  ])("%d samples -> %d bins", (n, bins) => {
    expect(binCount(n)).toBe(bins);
  });
});

describe("histogramStateLevels (IEEE 181-2011 5.2.1.1)", () => {
  it("two flat states with ramp samples between: the levels are the flat values, min and max the extremes", () => {
    const ramp = Array.from({ length: 40 }, (_, i) => 0.6 + (3.8 * (i + 0.5)) / 40); // 0.6..4.4 V
    const v = Float64Array.from([
      ...Array<number>(500).fill(0.2),
      ...ramp,
      ...Array<number>(500).fill(4.8),
      -0.3,
      5.4,
    ]);
    const s = histogramStateLevels(v);
    expect(s.low).toBeCloseTo(0.2, 12);
    expect(s.high).toBeCloseTo(4.8, 12);
    expect(s.min).toBe(-0.3);
    expect(s.max).toBe(5.4);
    expect(s.bins).toBe(binCount(v.length));
  });

  it("the high state is found when it is the trace's largest value (the top bin holds the maximum)", () => {
    const s = histogramStateLevels(trace([0, 300], [1, 10], [5, 300]));
    expect([s.low, s.high]).toEqual([0, 5]);
  });

  it("the level is the mean of the modal bin's samples, not the bin centre", () => {
    // 20 bins over 0.1..8 V, 0.395 V wide: 0.1 and 0.3 share bin 0, 7.9 and 8 the top bin.
    const s = histogramStateLevels(trace([0.1, 100], [0.3, 100], [8, 150], [7.9, 50]));
    expect(s.bins).toBe(20);
    expect(s.low).toBeCloseTo(0.2, 12);
    expect(s.high).toBeCloseTo((8 * 150 + 7.9 * 50) / 200, 12);
  });

  it("a crowded state just above the middle belongs to the upper half, not to the low state", () => {
    // 0..5 V, 32 bins of 0.15625 V; 2.55 V falls in bin 16, the first of the upper half.
    const v = trace([0, 300], [2.55, 500], [5, 200]);
    const s = histogramStateLevels(v);
    expect(s.bins).toBe(32);
    expect(s.low).toBe(0);
    expect(s.high).toBeCloseTo(2.55, 12);
  });

  it("a crowded state just below the middle belongs to the lower half", () => {
    // 2.45 V: bin 15, the last of the lower half
    const s = histogramStateLevels(trace([0, 300], [2.45, 500], [5, 200]));
    expect(s.bins).toBe(32);
    expect(s.low).toBeCloseTo(2.45, 12);
    expect(s.high).toBe(5);
  });

  it("of two equally full bins the lower one is the mode (our rule: the standard leaves ties open)", () => {
    // 20 bins over 0..16 V, 0.8 V wide. Upper half: 100 samples at 12.5 (bin 15) and 100 at 14.5 (bin 18).
    const s = histogramStateLevels(trace([0, 10], [0.5, 200], [12.5, 100], [14.5, 100], [16, 10]));
    expect(s.high).toBe(12.5);
    const low = histogramStateLevels(trace([0, 10], [2.5, 100], [4.5, 100], [15.5, 200], [16, 10]));
    expect(low.low).toBe(2.5);
  });

  it("a trace that ends in its low state still finds its maximum and high level", () => {
    const s = histogramStateLevels(trace([0, 50], [5, 300], [-2, 1], [0, 300]));
    expect([s.min, s.max, s.low, s.high]).toEqual([-2, 5, 0, 5]);
  });

  it("a flat trace has no two states: both levels are its one value", () => {
    const s = histogramStateLevels(trace([3.3, 100]));
    expect(s).toEqual({ low: 3.3, high: 3.3, min: 3.3, max: 3.3, bins: 16 });
  });

  it("negative levels work the same (a bipolar drive, -12 V and +12 V)", () => {
    const s = histogramStateLevels(trace([-12, 400], [0, 5], [12, 400]));
    expect([s.low, s.high, s.min, s.max]).toEqual([-12, 12, -12, 12]);
  });
});
