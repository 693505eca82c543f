// Two-channel capture of a relaxation (UJT-type) timing stage: the capacitor
// ramp and the output pulse fired at each discharge. Truth: the capacitor
// charges from the valley voltage Vv towards the supply Vs through R,
// v(t) = Vs - (Vs - Vv) exp(-t / RC), and fires at the peak voltage Vp, so the
// charge time is RC ln((Vs - Vv) / (Vs - Vp)) (RC charging, any circuits
// textbook); the period adds the discharge time.
import { describe, expect, it } from "vitest";
import { measureCsv } from "@/lib/capture";
import { toCsv } from "./fixtures/synth";

const VS = 12;
const VP = 8.16;
const VV = 2;
const RC = 10e3 * 100e-9; // 10 kOhm, 100 nF
const DISCHARGE_S = 5e-6;
const PERIOD_S = DISCHARGE_S + RC * Math.log((VS - VV) / (VS - VP));
const DT = 1e-6;

/** Ramp and a 10 V output pulse: 2 us edges, 50 % instants 30 us apart. */
function relaxationTrace(periods: number) {
  const n = Math.floor((periods * PERIOD_S) / DT);
  const t = new Float64Array(n);
  const ramp = new Float64Array(n);
  const pulse = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    t[i] = i * DT;
    // Firing instants k * PERIOD_S fall between samples, as on a real scope.
    const ph = t[i] - Math.floor(t[i] / PERIOD_S) * PERIOD_S;
    ramp[i] =
      ph < DISCHARGE_S
        ? VP - ((VP - VV) * ph) / DISCHARGE_S
        : VS - (VS - VV) * Math.exp(-(ph - DISCHARGE_S) / RC);
    const us = ph / 1e-6;
    pulse[i] = us < 2 ? 5 * us : us < 30 ? 10 : us < 32 ? 10 - 5 * (us - 30) : 0;
  }
  return { t, ramp, pulse };
}

describe("relaxation stage capture", () => {
  const { t, ramp, pulse } = relaxationTrace(12);

  it("measures the output pulse when it is the first voltage column", async () => {
    const csv = toCsv([t, pulse, ramp], { header: ["Time (s),Gate pulse (V),Capacitor (V)"] });
    const m = await measureCsv(csv);
    expect(m.columns[m.measuredColumn].name).toBe("Gate pulse");
    // Waveform period between successive rising 50 % instants (IEEE 181):
    // the pulse edges are straight over 2 samples, so interpolation is exact.
    expect(m.periodS.count).toBe(11);
    expect(m.periodS.mean).toBeCloseTo(PERIOD_S, 12);
    expect(m.periodS.max - m.periodS.min).toBeLessThan(1e-12);
    // Pulse duration between the 50 % instants: 1 us + 28 us + 1 us. The
    // modal bins also catch the odd edge sample, moving the levels by about
    // 0.2 mV and the 50 % instants by tens of ps: within 1 ns.
    expect(Math.abs(m.highS.mean - 30e-6)).toBeLessThan(1e-9);
    expect(m.duty).toBeCloseTo(30e-6 / PERIOD_S, 6);
    expect(Math.abs(m.lowLevelV)).toBeLessThan(1e-3);
    expect(Math.abs(m.highLevelV - 10)).toBeLessThan(1e-3);
  });

  it("measures the capacitor ramp when it is the first voltage column, ignoring the pulse", async () => {
    const csv = toCsv([t, ramp, pulse], { header: ["Time (s),Capacitor (V),Gate pulse (V)"] });
    const m = await measureCsv(csv);
    expect(m.columns[m.measuredColumn].name).toBe("Capacitor");
    // Measured as a ramp (capture.md "Ramps"): one trip per cycle, the first
    // (possibly cut) cycle dropped, so one period fewer than rising crossings.
    expect(m.waveform).toBe("ramp");
    expect(m.periodS.count).toBe(10);
    // Trip instants are samples (the peak of each cycle), so within one sample interval.
    expect(Math.abs(m.periodS.mean - PERIOD_S)).toBeLessThan(m.sampleIntervalS);
    expect(m.periodS.max - m.periodS.min).toBeLessThanOrEqual(2 * m.sampleIntervalS);
    // The levels are the release and trip voltages of the ramp.
    expect(m.lowLevelV).toBeGreaterThanOrEqual(VV - 1e-6);
    expect(m.highLevelV).toBeLessThanOrEqual(VP + 1e-6);
    // The fast discharge (5 us) is the falling edge, the charge the rising one.
    expect(m.fallS).toBeLessThanOrEqual(DISCHARGE_S + 2 * m.sampleIntervalS);
    expect(m.riseS).toBeGreaterThan(20 * DISCHARGE_S);
  });

  it("measures the second voltage column on request", async () => {
    const csv = toCsv([t, ramp, pulse], { header: ["Time (s),Capacitor (V),Gate pulse (V)"] });
    const m = await measureCsv(csv, { voltageColumn: 1 });
    expect(m.columns[m.measuredColumn].name).toBe("Gate pulse");
    expect(Math.abs(m.highS.mean - 30e-6)).toBeLessThan(1e-9);
  });
});
