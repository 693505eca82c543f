// Which traces count as ramps and how many cycles are counted (capture.md
// "Ramps": a slow ramp with a fast fall; ramp.ts: the 5:1 charge to discharge
// ratio is common practice, no source, and the first confirmed extreme is
// dropped as the record's start may cut it). Straight-line traces with whole
// sample counts, so every extreme is a sample.
import { describe, expect, it } from "vitest";
import { measureRamp } from "@/lib/capture";

const DT = 1e-6;

/** Up for `up` samples from 2 V to 8 V, down for `down` samples, from a valley at sample 0. */
function sawtooth(up: number, down: number, samples: number) {
  const t = new Float64Array(samples);
  const v = new Float64Array(samples);
  for (let i = 0; i < samples; i++) {
    t[i] = i * DT;
    const ph = i % (up + down);
    v[i] = ph <= up ? 2 + (6 * ph) / up : 8 - (6 * (ph - up)) / down;
  }
  return { t, v };
}

describe("ramp cycles", () => {
  it("a slow rise with a fast fall (45 : 5 samples) is a ramp; the first of six peaks is not counted", () => {
    // 310 samples: peaks at 45 + 50k (k = 0..5), valleys at 50k (k = 1..6);
    // the valley at 300 is never confirmed (no rise past 80 % after it).
    const { t, v } = sawtooth(45, 5, 310);
    const r = measureRamp(t, v);
    expect(r).not.toBeNull();
    expect(r!.peakV.count).toBe(5);
    expect(r!.peakTimesS[0]).toBeCloseTo(95 * DT, 15);
    expect(r!.periodS.count).toBe(4);
    // Period between successive falls (capture.md "Ramps"): 50 samples.
    expect(r!.periodS.mean).toBeCloseTo(50 * DT, 15);
    expect(r!.chargeS.mean).toBeCloseTo(45 * DT, 15);
    expect(r!.dischargeS.mean).toBeCloseTo(5 * DT, 15);
    expect(r!.peakV.mean).toBeCloseTo(8, 12);
    expect(r!.valleyV.mean).toBeCloseTo(2, 12);
  });

  it("a symmetric triangle (25 : 25 samples) is not a ramp", () => {
    const { t, v } = sawtooth(25, 25, 310);
    expect(measureRamp(t, v)).toBeNull();
  });
});
