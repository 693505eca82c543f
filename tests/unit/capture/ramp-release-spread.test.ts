// A ramp whose release (valley) voltage differs from cycle to cycle. capture.md
// "Ramps": `valleyV` is `{ mean, std, min, max, count }` over the cycles, so a
// cycle releasing above the record's lowest valley is still a cycle. ramp.ts
// finds cycles with hysteresis at 20 % and 80 % of the trace's span (common
// practice, no source): every valley here lies below 20 % of the span. The
// trace is built from straight segments between whole-sample knots, so every
// extreme is a sample and the expected figures follow from the knots.
import { describe, expect, it } from "vitest";
import { measureRamp } from "@/lib/capture";

const DT = 1e-6;
const UP = 45;
const DOWN = 5;
const CYCLE = UP + DOWN;
const PEAK_V = 8;
/** Release voltages, alternating: 2.6 V is 10 % of the 6 V span above the lowest. */
const VALLEYS_V = [2, 2.6];

/** Valleys at samples 50k (alternating 2 V and 2.6 V), peaks of 8 V at 50k + 45. */
function unevenRamp(samples: number) {
  const t = new Float64Array(samples);
  const v = new Float64Array(samples);
  for (let i = 0; i < samples; i++) {
    t[i] = i * DT;
    const k = Math.floor(i / CYCLE);
    const ph = i % CYCLE;
    const from = VALLEYS_V[k % 2];
    const next = VALLEYS_V[(k + 1) % 2];
    v[i] = ph <= UP ? from + ((PEAK_V - from) * ph) / UP : PEAK_V - ((PEAK_V - next) * (ph - UP)) / DOWN;
  }
  return { t, v };
}

describe("ramp with an uneven release voltage", () => {
  it("counts every cycle, the 2.6 V releases too, and reports the spread of the valleys", () => {
    // 310 samples: peaks at 45 + 50k (k = 0..5), valleys at 50k (k = 1..6). The
    // first peak is dropped (the record's start may cut it) and the valley at
    // 300 is never confirmed (no rise past 80 % after it): peaks 95..295 and
    // valleys 50..250 (k = 1..5: 2.6, 2, 2.6, 2, 2.6 V).
    const { t, v } = unevenRamp(310);
    const r = measureRamp(t, v);
    expect(r).not.toBeNull();
    expect(r!.peakV.count).toBe(5);
    expect(r!.valleyV.count).toBe(5);
    expect(r!.valleyV.min).toBeCloseTo(2, 12);
    expect(r!.valleyV.max).toBeCloseTo(2.6, 12);
    expect(r!.valleyV.mean).toBeCloseTo((3 * 2.6 + 2 * 2) / 5, 12);
    // capture.md: period between successive falls, one cycle of 50 samples.
    expect(r!.periodS.count).toBe(4);
    expect(r!.periodS.mean).toBeCloseTo(CYCLE * DT, 15);
    expect(r!.chargeS.mean).toBeCloseTo(UP * DT, 15);
    expect(r!.dischargeS.mean).toBeCloseTo(DOWN * DT, 15);
  });
});
