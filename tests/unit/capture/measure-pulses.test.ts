// Pulse measurement against traces whose truth is known by construction.
// Definitions: IEEE Std 181-2011, "IEEE Standard for Transitions, Pulses, and
// Related Waveforms" (clause numbers from memory): state levels by the
// histogram method (5.2); reference levels at 10/50/90 % of the amplitude
// between the state levels; transition duration = interval between the 10 %
// and 90 % reference level instants; pulse duration = interval between the
// 50 % instants of the first and second transitions of a pulse; waveform
// period = interval between 50 % instants of successive like transitions;
// duty factor = pulse duration / waveform period.
import { describe, expect, it } from "vitest";
import { measureCsv } from "@/lib/capture";
import { gaussian, toCsv, trapezoid, trapezoidTruth, type Trapezoid } from "./fixtures/synth";

const HEADER = ["Time (s),Out (V)"];

describe("clean trapezoid pulse train", () => {
  const p: Trapezoid = {
    n: 10_000,
    dtS: 1e-6,
    period: 1000,
    delay: 100,
    rise: 10,
    top: 295,
    fall: 5,
    lowV: 0.2,
    highV: 4.8,
  };
  const truth = trapezoidTruth(p);

  it("recovers state levels, period, pulse duration, duty and 10-90 % edges exactly", async () => {
    const { t, v } = trapezoid(p);
    const m = await measureCsv(toCsv([t, v], { header: HEADER }));
    expect(m.samples).toBe(p.n);
    // IEEE 181 histogram method: the two modes are the flat low and high parts.
    expect(m.lowLevelV).toBeCloseTo(0.2, 12);
    expect(m.highLevelV).toBeCloseTo(4.8, 12);
    // Reference levels 10/50/90 % of the amplitude (IEEE 181).
    expect(m.referenceV.p10).toBeCloseTo(0.2 + 0.46, 12);
    expect(m.referenceV.p50).toBeCloseTo(2.5, 12);
    expect(m.referenceV.p90).toBeCloseTo(0.2 + 4.14, 12);
    // Waveform period: rises at 105 us + k ms, k = 0..9 -> 9 periods.
    expect(m.periodS.count).toBe(9);
    expect(m.periodS.mean).toBeCloseTo(truth.periodS, 15);
    expect(m.periodS.std).toBeLessThan(1e-15);
    // Pulse duration (50 % to 50 %): 5 + 295 + 2.5 us.
    expect(m.highS.count).toBe(10);
    expect(m.highS.mean).toBeCloseTo(302.5e-6, 15);
    expect(m.highS.min).toBeCloseTo(302.5e-6, 15);
    expect(m.highS.max).toBeCloseTo(302.5e-6, 15);
    expect(m.lowS.mean).toBeCloseTo(truth.periodS - 302.5e-6, 15);
    // Duty factor = pulse duration / waveform period.
    expect(m.duty).toBeCloseTo(0.3025, 12);
    expect(m.frequencyHz).toBeCloseTo(1000, 6);
    // Transition duration 10-90 %: 0.8 of a 10 us and a 5 us linear ramp.
    expect(m.riseS).toBeCloseTo(8e-6, 15);
    expect(m.fallS).toBeCloseTo(4e-6, 15);
    expect(m.riseTimes.count).toBe(10);
    expect(m.edgesTotal).toBe(20);
    expect(m.edges[0]).toEqual({ tS: expect.closeTo(truth.firstRiseS, 15), kind: "rise" });
    expect(m.edges[1].kind).toBe("fall");
    expect(m.edges[1].tS).toBeCloseTo(407.5e-6, 15);
    expect(m.sampleIntervalS).toBeCloseTo(1e-6, 15);
    expect(m.durationS).toBeCloseTo((p.n - 1) * 1e-6, 15);
    expect(m.warnings).toEqual([]);
  });

  it("warns when the capture holds a single period", async () => {
    const { t, v } = trapezoid({ ...p, n: 1600 });
    const m = await measureCsv(toCsv([t, v], { header: HEADER }));
    expect(m.periodS.count).toBe(1);
    expect(m.periodS.std).toBe(0);
    expect(m.warnings.map((w) => w.code)).toContain("few-periods");
    // The product's own warning text (measure.ts), naming the count it found.
    expect(m.warnings.find((w) => w.code === "few-periods")?.message).toBe(
      "only 1 full period in the capture; spread needs at least 2",
    );
  });

  it("does not warn when the capture holds two periods", async () => {
    // 2600 samples: rises at 105, 1105 and 2105 us, so two waveform periods
    // (IEEE 181: between successive rising 50 % instants). A sample standard
    // deviation needs two values (n - 1 in its denominator; textbook, from
    // memory), which two periods give.
    const { t, v } = trapezoid({ ...p, n: 2600 });
    const m = await measureCsv(toCsv([t, v], { header: HEADER }));
    expect(m.periodS.count).toBe(2);
    expect(m.periodS.mean).toBeCloseTo(truth.periodS, 15);
    expect(m.warnings).toEqual([]);
  });
});

describe("square wave with Gaussian noise", () => {
  // A = 5 V, sigma = 50 mV, 0-100 % ramps of 20 samples at 100 ns: slope
  // 2.5 V/us. Timing jitter of a level crossing from additive noise is
  // sigma_t = sigma_v / slope (textbook first-order result, from memory):
  // 20 ns per sample. Interpolating between two noisy samples averages it to
  // sigma_v * sqrt((1-f)^2 + f^2) / slope, mean square 2/3 over f, so one
  // crossing has ~16 ns and a period (two crossings) ~23 ns.
  const p: Trapezoid = {
    n: 20_000,
    dtS: 100e-9,
    period: 1000,
    delay: 200,
    rise: 20,
    top: 480,
    fall: 20,
    lowV: 0,
    highV: 5,
  };
  const truth = trapezoidTruth(p);

  for (const seed of [1, 7, 181]) {
    it(`stays within the noise-derived limits (seed ${seed})`, async () => {
      const { t, v } = trapezoid(p);
      const g = gaussian(seed);
      for (let i = 0; i < v.length; i++) v[i] += 0.05 * g();
      const m = await measureCsv(toCsv([t, v], { header: HEADER }));
      // Histogram state levels: within 2 % of amplitude (bin width ~0.8 %,
      // common practice, no source).
      expect(Math.abs(m.lowLevelV - 0)).toBeLessThan(0.1);
      expect(Math.abs(m.highLevelV - 5)).toBeLessThan(0.1);
      // Hysteresis at 10/90 % (10 sigma from the states): no false edges.
      expect(m.edgesTotal).toBe(40);
      expect(m.periodS.count).toBe(19);
      // Mean of 19 periods telescopes to (last - first rise) / 19: sigma
      // ~23 ns / 19 ~ 1.2 ns; limit 10 ns.
      expect(Math.abs(m.periodS.mean - truth.periodS)).toBeLessThan(10e-9);
      // Period spread near the predicted 23 ns.
      expect(m.periodS.std).toBeGreaterThan(10e-9);
      expect(m.periodS.std).toBeLessThan(45e-9);
      expect(m.periodS.max - m.periodS.min).toBeLessThan(6 * 45e-9);
      // Pulse duration: 20 values of sigma ~23 ns, mean within 30 ns.
      expect(Math.abs(m.highS.mean - truth.highS)).toBeLessThan(30e-9);
      expect(Math.abs(m.duty - 0.5)).toBeLessThan(0.001);
      // 10-90 % transition duration 1.6 us, mean of 20 within 20 ns.
      expect(Math.abs(m.riseS - truth.riseS)).toBeLessThan(20e-9);
      expect(Math.abs(m.fallS - truth.fallS)).toBeLessThan(20e-9);
    });
  }
});

describe("slow linear edges", () => {
  it("measures 10-90 % transition durations of 320 us and 160 us", async () => {
    const p: Trapezoid = {
      n: 12_000,
      dtS: 1e-6,
      period: 2000,
      delay: 50,
      rise: 400,
      top: 100,
      fall: 200,
      lowV: -1,
      highV: 11,
    };
    const { t, v } = trapezoid(p);
    const m = await measureCsv(toCsv([t, v], { header: HEADER }));
    // Histogram method: the modal bin of the 100-sample top also holds the
    // ~5 ramp samples per period that fall inside that bin (width 12 V /
    // 110 bins), pulling the high level ~3 mV low: amplitude -0.02 %.
    expect(Math.abs(m.highLevelV - 11)).toBeLessThan(0.01);
    expect(Math.abs(m.lowLevelV + 1)).toBeLessThan(0.01);
    // Transition duration between the 10 % and 90 % instants (IEEE 181):
    // 0.8 x the 0-100 % ramp of a straight edge, scaled by that amplitude
    // error; limit 0.1 %.
    expect(Math.abs(m.riseS / 320e-6 - 1)).toBeLessThan(1e-3);
    expect(Math.abs(m.fallS / 160e-6 - 1)).toBeLessThan(1e-3);
    expect(m.riseTimes.std).toBeLessThan(1e-12);
    // Period: the same 50 % level on every cycle, so exact.
    expect(m.periodS.mean).toBeCloseTo(2e-3, 12);
    // Pulse duration 200 + 100 + 100 us between 50 % instants; the 1.5 mV
    // shift of the 50 % level moves the slow instants by ~70 ns in all.
    expect(Math.abs(m.highS.mean - 400e-6)).toBeLessThan(200e-9);
    expect(Math.abs(m.duty - 0.2)).toBeLessThan(1e-4);
    expect(m.warnings).toEqual([]);
  });
});

describe("one-sample glitches", () => {
  const p: Trapezoid = {
    n: 10_000,
    dtS: 1e-6,
    period: 1000,
    delay: 0,
    rise: 2,
    top: 498,
    fall: 2,
    lowV: 0,
    highV: 5,
  };

  it("ignores spikes that cross 50 % but not the far hysteresis level", async () => {
    const { t, v } = trapezoid(p);
    const clean = await measureCsv(toCsv([t, v], { header: HEADER }));
    // A spike to 70 % while low and a dip to 30 % while high: both cross the
    // 50 % level, neither reaches the other state's 90 % / 10 % boundary.
    v[3700] = 3.5;
    v[5250] = 1.5;
    const m = await measureCsv(toCsv([t, v], { header: HEADER }));
    expect(m.edgesTotal).toBe(clean.edgesTotal);
    expect(m.periodS).toEqual(clean.periodS);
    expect(m.highS).toEqual(clean.highS);
    // The min/max envelope keeps the spike visible on the plot.
    expect(m.plot.length).toBeLessThanOrEqual(2000);
    expect(Math.max(...m.plot.map((pt) => pt.maxV).filter((x) => x < 4))).toBe(3.5);
    expect(Math.min(...m.plot.map((pt) => pt.minV).filter((x) => x > 1))).toBe(1.5);
  });

  it("counts a full-swing one-sample spike: it reaches the other state", async () => {
    const { t, v } = trapezoid(p);
    const clean = await measureCsv(toCsv([t, v], { header: HEADER }));
    v[3700] = 5;
    const m = await measureCsv(toCsv([t, v], { header: HEADER }));
    expect(m.edgesTotal).toBe(clean.edgesTotal + 2);
    expect(m.highS.min).toBeCloseTo(1e-6, 12);
  });
});
