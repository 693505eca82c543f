// The sketch of a mains-synchronised stage (engine.md section 6, waveform.ts):
// each half cycle starts at the zero crossing with the capacitor empty and the
// output low; the output is high only from the firing delay for the gate pulse.
import { describe, expect, it } from "vitest";
import { analyzeStage, stageWaveform, type Stage } from "@/lib/engine";

describe("stageWaveform of a mains-synchronised UJT stage", () => {
  it("low and charging from 0 V before the firing delay, high from the delay for the pulse", () => {
    // Our own demo values; 50 Hz mains: a half cycle is 1 / (2 * 50 Hz) = 10 ms.
    const s = {
      kind: "ujt",
      supplyV: 20,
      timingR: 47e3,
      timingC: 100e-9,
      eta: 0.63,
      sync: { mainsHz: 50, mainsVrms: 230 },
    } as Stage;
    const a = analyzeStage(s);
    const delay = a.sync!.firingDelayS;
    const half = a.sync!.halfCycleS;
    expect(half).toBeCloseTo(10e-3, 12);
    expect(delay).toBeGreaterThan(0);
    const w = stageWaveform(s, a, 400);
    expect(w[0]).toMatchObject({ tS: 0, capV: 0, out: 0 });
    // The last point closes the second half cycle at its end level (no capacitor trace): left out.
    for (const p of w.slice(0, -1)) {
      const t = p.tS % half;
      if (t < delay) {
        expect(p.out).toBe(0);
        expect(p.capV).toBeGreaterThanOrEqual(0);
      } else if (t > delay && t < delay + a.highS) expect(p.out).toBe(1);
    }
    expect(w.some((p) => p.out === 1)).toBe(true);
    // The sketch places a point on each edge: at the firing instant itself the output is already high.
    const firing = w.find((p) => p.tS === delay);
    expect(firing?.out).toBe(1);
  });
});
