// Mains-synchronised stages (engine.md section 6): load RMS / power formula,
// the closed-form charge against an independent numerical integration, the
// never-fires check, the inverse (power fraction -> angle -> delay -> R),
// tolerance spread of the delay, and the refusals of a bad sync block.
import { describe, expect, it } from "vitest";
import {
  analyzeStage,
  angleForPowerFraction,
  delayForAngle,
  firingDelay,
  loadRmsFraction,
  suggestTimingR,
  type UjtStage,
} from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

const ujt: UjtStage & { sync: { mainsHz: number; mainsVrms: number } } = {
  kind: "ujt",
  supplyV: 20,
  timingR: 47e3,
  timingC: 100e-9,
  eta: 0.63,
  sync: { mainsHz: 50, mainsVrms: 230 },
};

describe("load RMS and power of a full-wave controller with a resistive load", () => {
  // Rashid, Power Electronics: Circuits, Devices and Applications, chapter on AC
  // voltage controllers, worked example of the single-phase full-wave controller:
  // Vs = 120 V rms, R = 10 ohm, alpha = pi/2 -> Vo = 84.85 V rms, input power
  // factor 0.707 (from memory: example number not checked).
  it("alpha = 90 deg: 120 V in, 84.85 V out (textbook worked example)", () => {
    expect(120 * loadRmsFraction(Math.PI / 2)).toBeCloseTo(84.85, 2);
  });

  // Independent check of the closed form: the RMS of a sine conducting from
  // alpha to pi in each half cycle, integrated numerically (midpoint rule,
  // 200 000 steps) -- the definition of RMS, no formula shared with the engine.
  it("matches the numerically integrated RMS of the chopped sine at 0..180 deg", () => {
    for (const deg of [0, 15, 30, 60, 90, 120, 150, 175, 180]) {
      const a = (deg * Math.PI) / 180;
      const n = 200000;
      let sum = 0;
      for (let i = 0; i < n; i++) {
        const x = ((i + 0.5) * Math.PI) / n;
        if (x >= a) sum += Math.sin(x) ** 2;
      }
      const rms = Math.sqrt(sum / n) / Math.SQRT1_2; // relative to the full sine's RMS
      expect(loadRmsFraction(a)).toBeCloseTo(rms, 4);
    }
  });

  it("analysis: power fraction is the RMS fraction squared, conduction = 180 - firing angle", () => {
    const s = analyzeStage(ujt).sync!;
    expect(s.loadPowerFraction).toBeCloseTo(s.loadRmsFraction ** 2, 12);
    expect(s.conductionAngleDeg + s.firingAngleDeg).toBeCloseTo(180, 9);
    expect(s.firingAngleDeg).toBeCloseTo((180 * s.firingDelayS) / 0.01, 9);
  });
});

describe("firing delay against an independent integration of the RC equation", () => {
  // dv/dt = (min(Vpk|sin wt|, Vz) - v)/(RC), v(0) = 0, classical RK4 with 10^5 steps
  // per half cycle; the first crossing of the trip voltage interpolated linearly.
  // First-order RC circuit, any circuit-analysis textbook; RK4 as in any
  // numerical-methods text (e.g. Press et al., Numerical Recipes, chapter 16).
  function rk4Delay(x: { hz: number; vrms: number; clamp: number; r: number; c: number; trip: number }) {
    const w = 2 * Math.PI * x.hz;
    const amp = Math.SQRT2 * x.vrms;
    const f = (t: number, v: number) =>
      (Math.min(amp * Math.abs(Math.sin(w * t)), x.clamp) - v) / (x.r * x.c);
    const half = 1 / (2 * x.hz);
    const n = 100000;
    const h = half / n;
    let v = 0;
    for (let i = 0; i < n; i++) {
      const t = i * h;
      const k1 = f(t, v);
      const k2 = f(t + h / 2, v + (h * k1) / 2);
      const k3 = f(t + h / 2, v + (h * k2) / 2);
      const k4 = f(t + h, v + h * k3);
      const next = v + (h / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
      if (next >= x.trip) return t + (h * (x.trip - v)) / (next - v);
      v = next;
    }
    return null;
  }

  const cases = [
    { hz: 50, vrms: 230, clamp: 20, r: 47e3, c: 100e-9, trip: 13.2 },
    { hz: 60, vrms: 120, clamp: 24, r: 10e3, c: 470e-9, trip: 15 },
    { hz: 50, vrms: 230, clamp: 150, r: 220e3, c: 22e-9, trip: 90 },
    // no clamp reached: 24 V rms on a 47 V zener, trip on the falling sine
    { hz: 50, vrms: 24, clamp: 47, r: 33e3, c: 220e-9, trip: 14 },
  ];
  for (const x of cases) {
    it(`${x.vrms} V ${x.hz} Hz, clamp ${x.clamp} V, RC ${x.r * x.c} s, trip ${x.trip} V: within 0.1 %`, () => {
      const want = rk4Delay(x);
      expect(want).not.toBeNull();
      const got = firingDelay({
        mainsHz: x.hz,
        mainsVrms: x.vrms,
        clampV: x.clamp,
        r: x.r,
        c: x.c,
        peakV: x.trip,
      });
      expect(got).not.toBeNull();
      expect(Math.abs(got! - want!) / want!).toBeLessThan(1e-3);
    });
  }

  it("a trip voltage never reached gives null, as the integration says", () => {
    const x = { hz: 50, vrms: 230, clamp: 20, r: 470e3, c: 100e-9, trip: 13.2 };
    expect(rk4Delay(x)).toBeNull();
    expect(
      firingDelay({ mainsHz: 50, mainsVrms: 230, clampV: 20, r: x.r, c: x.c, peakV: x.trip }),
    ).toBeNull();
  });
});

describe("synchronised analysis", () => {
  it("one firing per half cycle: periodS = 1/(2 f), highS = the discharge pulse", () => {
    const a = analyzeStage(ujt);
    const free = analyzeStage({ ...ujt, sync: undefined });
    expect(a.periodS).toBeCloseTo(0.01, 12);
    expect(a.highS).toBeCloseTo(free.highS, 15);
    expect(a.lowS).toBeCloseTo(0.01 - a.highS, 15);
    expect(a.oscillates).toBe(true);
  });

  it("never fires within the half cycle: an error check naming timingR with a resistor that would", () => {
    const a = analyzeStage({ ...ujt, timingR: 470e3 });
    expect(a.oscillates).toBe(false);
    expect(a.sync).toBeUndefined();
    const c = a.checks.find((x) => x.code === "never-fires");
    expect(c?.level).toBe("error");
    expect(c?.field).toBe("timingR");
    expect(c?.message).toMatch(/never fires/);
    expect(c?.message).toMatch(/timing resistor below/);
  });

  it("clamp below the trip point: an error check naming supplyV", () => {
    // eta 0.63 on a 20 V clamp trips at 13.2 V; 9 V rms mains peaks at 12.7 V.
    const a = analyzeStage({ ...ujt, sync: { mainsHz: 50, mainsVrms: 9 } });
    const c = a.checks.find((x) => x.code === "never-fires");
    expect(c?.field).toBe("supplyV");
  });

  it("tolerances: the spread covers the firing delay and brackets the nominal", () => {
    const a = analyzeStage(
      { ...ujt, tolerances: { timingR: 0.05, timingC: 0.1, eta: 0.05 } },
      { samples: 2000 },
    );
    const d = a.spread!.firingDelayS!;
    expect(d.corners.min).toBeLessThan(a.sync!.firingDelayS);
    expect(d.corners.max).toBeGreaterThan(a.sync!.firingDelayS);
    // Truncated sampling stays inside the corner box (tolerance.ts); the model is monotonic in R, C, eta.
    expect(d.monteCarlo.q00135).toBeGreaterThanOrEqual(d.corners.min);
    expect(d.monteCarlo.q99865).toBeLessThanOrEqual(d.corners.max);
  });
});

describe("the inverse: wanted power or angle -> delay -> timing resistor", () => {
  it("half power is 90 deg (the textbook example above), quarter cycle = 5 ms at 50 Hz", () => {
    expect(angleForPowerFraction(0.5)).toBeCloseTo(90, 6);
    expect(delayForAngle(90, 50)).toBeCloseTo(0.005, 12);
  });

  it("angleForPowerFraction reads loadRmsFraction back", () => {
    for (const p of [0.05, 0.2, 0.5, 0.8, 0.95]) {
      const a = angleForPowerFraction(p);
      expect(loadRmsFraction((a * Math.PI) / 180) ** 2).toBeCloseTo(p, 9);
    }
  });

  it("suggestTimingR gives a resistor that fires at the wanted delay", () => {
    const delay = delayForAngle(angleForPowerFraction(0.3), 50);
    const r = suggestTimingR(ujt, delay)!;
    expect(r).toBeGreaterThan(1e3);
    expect(analyzeStage({ ...ujt, timingR: r }).sync!.firingDelayS).toBeCloseTo(delay, 9);
    expect(suggestTimingR(ujt, 0.02)).toBeNull(); // beyond the half cycle
  });
});

describe("bad sync blocks are refused, naming the field", () => {
  it("frequency, voltage, unknown keys, wrong stage kind", () => {
    expectEngineError(
      () => analyzeStage({ ...ujt, sync: { mainsHz: 0, mainsVrms: 230 } }),
      "invalid-stage",
      "sync.mainsHz",
    );
    expectEngineError(
      () => analyzeStage({ ...ujt, sync: { mainsHz: 50, mainsVrms: -1 } }),
      "invalid-stage",
      "sync.mainsVrms",
    );
    expectEngineError(
      () => analyzeStage({ ...ujt, sync: { mainsHz: 50, mainsVrms: 230, phase: 1 } as never }),
      "invalid-stage",
      "sync.phase",
    );
    expectEngineError(
      () =>
        analyzeStage({
          kind: "timer555-monostable",
          r: 1e3,
          c: 1e-6,
          sync: { mainsHz: 50, mainsVrms: 230 },
        } as never),
      "invalid-stage",
      "sync",
    );
  });
});
