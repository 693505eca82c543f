// IEEE Std 181-2011 measurements on a pulse train with the distortions a
// real scope capture has: overshoot with ringing after each rise, a smaller
// undershoot after each fall, a DC offset, a little noise, and runt pulses
// (pulses that cross the 50 % level but not both the 10 % and 90 % levels).
// Expected values are worked out here from the standard's definitions
// (clause numbers from memory):
// - state levels by the histogram method: the modes of the amplitude
//   histogram in its lower and upper halves. The settled parts of the wave
//   hold most samples of each half, so the modes are the settled levels
//   lowV + offset and highV + offset, not the extremes of the overshoot;
// - reference levels 10 / 50 / 90 % of the amplitude between those states;
// - a transition needs the wave to leave one state and reach the other
//   (hysteresis between the 10 % and 90 % levels), so a runt is no
//   transition; its instant is the 50 % crossing, its duration 10 %-90 %.
// On the linear ramps of this wave the 50 % crossing is half way up the
// ramp and the 10-90 % duration is 0.8 of the ramp length.
import { describe, expect, it } from "vitest";
import { measureTrace, type CaptureTrace } from "@/lib/capture";
import { gaussian } from "./fixtures/synth";

const DT = 1e-6; // s per sample
const P = 1000; // samples per period
const DELAY = 100; // first rise starts here (samples)
const RISE = 40;
const TOP = 300;
const FALL = 40;
const PERIODS = 20;
const LOW = 0;
const HIGH = 5;
const A = HIGH - LOW;
const NOISE_V = 0.002;

interface Distortion {
  offsetV: number;
  /** overshoot after the rise, fraction of the amplitude */
  overshoot: number;
  /** undershoot after the fall, fraction of the amplitude */
  undershoot: number;
  /** every third period: a positive runt in the low part (to 0.7 A) and a negative one in the high part (to 0.3 A) */
  runts: boolean;
}

// damped ringing: starts at its peak, decays by e every 8 samples, period 16
// samples; its first opposite swing is 0.37 of the peak, so a 20 % overshoot
// stays above the 90 % level and a 12 % undershoot below the 10 % level
const ring = (k: number) => Math.exp(-k / 8) * Math.cos((2 * Math.PI * k) / 16);
// a triangular runt of 40 samples, peak at its middle
const runt = (k: number, peak: number) => (k < 0 || k > 40 ? 0 : peak * (1 - Math.abs(k - 20) / 20));

function wave(d: Distortion): CaptureTrace {
  const n = PERIODS * P;
  const t = new Float64Array(n);
  const v = new Float64Array(n);
  const noise = gaussian(181);
  for (let i = 0; i < n; i++) {
    const cycle = Math.floor((i - DELAY) / P);
    const ph = i - DELAY - cycle * P; // 0..P-1 within the pulse starting at DELAY
    const withRunts = d.runts && ((cycle % 3) + 3) % 3 === 1;
    let x: number;
    if (i < DELAY) x = LOW;
    else if (ph < RISE) x = LOW + (A * ph) / RISE;
    else if (ph < RISE + TOP) {
      x = HIGH + d.overshoot * A * ring(ph - RISE);
      if (withRunts) x -= runt(ph - RISE - 150, 0.7 * A); // dips to 0.3 A: below 50 %, not below 10 %
    } else if (ph < RISE + TOP + FALL) x = HIGH - (A * (ph - RISE - TOP)) / FALL;
    else {
      x = LOW - d.undershoot * A * ring(ph - RISE - TOP - FALL);
      if (withRunts) x += runt(ph - RISE - TOP - FALL - 250, 0.7 * A); // up to 0.7 A: above 50 %, not above 90 %
    }
    t[i] = i * DT;
    v[i] = x + d.offsetV + NOISE_V * noise();
  }
  return { t, v, columns: [], measuredColumn: 0, header: [], firstDataLine: 1, warnings: [] };
}

const CASES: [string, Distortion][] = [
  ["overshoot and ringing, no offset", { offsetV: 0, overshoot: 0.2, undershoot: 0.12, runts: false }],
  [
    "overshoot, ringing and +1.7 V DC offset",
    { offsetV: 1.7, overshoot: 0.2, undershoot: 0.12, runts: false },
  ],
  [
    "overshoot, ringing, -2.5 V offset and runt pulses",
    { offsetV: -2.5, overshoot: 0.2, undershoot: 0.12, runts: true },
  ],
];

describe("IEEE 181 measurements on a distorted pulse train", () => {
  for (const [name, d] of CASES)
    it(name, () => {
      const m = measureTrace(wave(d));
      // state levels: the settled levels (histogram modes), within the noise
      expect(Math.abs(m.lowLevelV - (LOW + d.offsetV))).toBeLessThan(0.005);
      expect(Math.abs(m.highLevelV - (HIGH + d.offsetV))).toBeLessThan(0.005);
      // and not the extremes: the min/max midpoint is 0.04 A = 0.2 V off the 50 % level
      const mid = LOW + d.offsetV + 0.5 * A;
      expect(Math.abs(m.referenceV.p50 - mid)).toBeLessThan(0.005);
      expect(Math.abs(m.referenceV.p10 - (LOW + d.offsetV + 0.1 * A))).toBeLessThan(0.005);
      expect(Math.abs(m.referenceV.p90 - (LOW + d.offsetV + 0.9 * A))).toBeLessThan(0.005);

      // one rise and one fall per period; runts add none
      expect(m.edgesTotal).toBe(2 * PERIODS);
      expect(m.edges[0]).toMatchObject({ kind: "rise" });
      expect(m.edges[0].tS / DT).toBeCloseTo(DELAY + RISE / 2, 1);
      expect(m.periodS.count).toBe(PERIODS - 1);
      // 50 %-50 %: rise crossing at RISE/2, fall crossing at RISE + TOP + FALL/2
      const highSamples = RISE / 2 + TOP + FALL / 2;
      // a 50 % level 0.04 A off moves each crossing 1.6 samples: 0.05 samples tolerance
      expect(Math.abs(m.highS.mean / DT - highSamples)).toBeLessThan(0.05);
      expect(Math.abs(m.periodS.mean / DT - P)).toBeLessThan(0.05);
      expect(Math.abs(m.duty - highSamples / P)).toBeLessThan(1e-4);
      // 10-90 % transition durations: 0.8 of the ramps
      expect(Math.abs(m.riseS / DT - 0.8 * RISE)).toBeLessThan(0.1);
      expect(Math.abs(m.fallS / DT - 0.8 * FALL)).toBeLessThan(0.1);
    });

  it("the runts really cross the 50 % level (so the test above would see a detector without hysteresis)", () => {
    const tr = wave(CASES[2][1]);
    const mid = LOW - 2.5 + 0.5 * A;
    let crossings = 0;
    for (let i = 1; i < tr.v.length; i++) if (tr.v[i - 1] < mid !== tr.v[i] < mid) crossings++;
    // 40 real edges, and each of the 7 runt periods (cycles 1, 4, ..., 19) adds 2 runts x 2 crossings
    expect(crossings).toBe(2 * PERIODS + 7 * 4);
    // and the extremes are where overshoot and undershoot put them, so min/max differ from the states
    const max = Math.max(...tr.v);
    const min = Math.min(...tr.v);
    expect(max - (HIGH - 2.5)).toBeGreaterThan(0.19 * A);
    expect(LOW - 2.5 - min).toBeGreaterThan(0.11 * A);
  });
});
