import { describe, expect, it } from "vitest";
import { analyzeTravel, taperFraction, taperRotation, type Stage } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

const LN2 = Math.log(2);

// 555 astable with a rate pot in place of Rb: T = ln2*(Ra + 2*Rb)*C
// (NE555 datasheet, Texas Instruments SLFS022, astable operation), so the
// period is linear in the rotation of a linear pot.
const astable: Stage = { kind: "timer555-astable", supplyV: 12, ra: 1e3, rb: 10e3, c: 1e-6 };
const pot = { kind: "pot", field: "rb", seriesR: 2.2e3, trackR: 47e3, taper: "linear" } as const;

describe("potentiometer travel of a 555 astable (SLFS022 astable formula)", () => {
  it("gives the datasheet period at minimum, middle and maximum rotation", () => {
    const t = analyzeTravel(astable, pot, 5);
    expect(t.quantity).toBe("periodS");
    expect(t.points.map((p) => p.position)).toEqual([0, 0.25, 0.5, 0.75, 1]);
    for (const p of t.points) {
      const rb = 2.2e3 + 47e3 * p.position;
      expect(p.value).toBeCloseTo(rb, 6);
      expect(p.timingS / (LN2 * (1e3 + 2 * rb) * 1e-6)).toBeCloseTo(1, 9);
    }
    expect(t.checks).toEqual([]);
    expect(t.limits).toEqual([]);
    expect(t.runningRange?.minS).toBeCloseTo(LN2 * (1e3 + 4.4e3) * 1e-6, 12);
  });

  it("draws the tolerance band from the stage's tolerances around each point", () => {
    const t = analyzeTravel({ ...astable, tolerances: { c: 0.1 } }, pot, 3);
    for (const p of t.points) {
      // C is the only toleranced part and T is proportional to C (SLFS022).
      expect(p.band!.min / p.timingS).toBeCloseTo(0.9, 9);
      expect(p.band!.max / p.timingS).toBeCloseTo(1.1, 9);
    }
  });

  it("a selector of timing capacitors gives one point per switch position", () => {
    const t = analyzeTravel(astable, { kind: "selector", field: "c", values: [100e-9, 1e-6, 10e-6] });
    expect(t.points.map((p) => p.timingS / (LN2 * 21e3 * p.value))).toEqual([
      expect.closeTo(1, 9),
      expect.closeTo(1, 9),
      expect.closeTo(1, 9),
    ]);
  });
});

describe("log taper (10 % of the track at half rotation: common practice, no source)", () => {
  it("is exact at both ends, 10 % at the middle, and inverts", () => {
    expect(taperFraction("log", 0)).toBe(0);
    expect(taperFraction("log", 1)).toBeCloseTo(1, 12);
    expect(taperFraction("log", 0.5)).toBeCloseTo(0.1, 12);
    for (const x of [0.1, 0.37, 0.9])
      expect(taperRotation("log", taperFraction("log", x))).toBeCloseTo(x, 12);
    expect(taperFraction("linear", 0.3)).toBe(0.3);
  });
});

describe("will-it-oscillate limits over the travel", () => {
  // UJT load line: it runs only for (Vs - Vv)/Iv < R < (Vs - Vp)/Ip
  // (General Electric SCR Manual, UJT chapter, from memory). Vs 12 V, eta 0.63,
  // VD 0.6 V: Vp = 8.16 V; Ip 5 uA gives R below 768 kΩ.
  const ujt: Stage = { kind: "ujt", supplyV: 12, timingR: 47e3, timingC: 1e-6, eta: 0.63 };
  it("places the limit where the pot crosses (Vs - Vp)/Ip and explains it", () => {
    const t = analyzeTravel(
      ujt,
      { kind: "pot", field: "timingR", seriesR: 100e3, trackR: 1e6, taper: "linear" },
      11,
    );
    expect(t.limits).toHaveLength(1);
    expect(t.limits[0].side).toBe("stops-above");
    expect(t.limits[0].value).toBeCloseTo((12 - 8.16) / 5e-6, -2);
    expect(t.points.at(-1)!.oscillates).toBe(false);
    // a stopped point carries the stage's own reason: 1.1 MΩ at full travel
    expect(t.points.at(-1)!.reason).toBe(
      "Timing resistor 1.1 MΩ cannot supply the peak-point current (5 µA) at the trip voltage: the UJT never fires. Use a timing resistor from 2.5 kΩ to 768 kΩ.",
    );
    expect(t.points[0].reason).toBeUndefined();
    expect(t.points[0].oscillates).toBe(true);
    const check = t.checks.find((c) => c.code === "control-crosses-limit");
    expect(check?.level).toBe("error");
    expect(check?.field).toBe("control.trackR");
    expect(check?.message).toMatch(/above 66\.\d % of the travel/);
  });

  it("names both limits when the travel leaves the running range at both ends", () => {
    // Same UJT: below (Vs - Vv)/Iv it latches on. With the stage's default valley point
    // (2 V, 4 mA; the stage's own reason below states them) that is 10 V / 4 mA = 2.5 kΩ.
    // A 1 kΩ + 1.1 MΩ linear pot is R = 1 kΩ + x * 1.1 MΩ: under 2.5 kΩ below
    // x = 1.5/1100 = 0.14 % and over 768 kΩ above x = 767/1100 = 69.7 % of the travel.
    const t = analyzeTravel(
      ujt,
      { kind: "pot", field: "timingR", seriesR: 1e3, trackR: 1.1e6, taper: "linear" },
      11,
    );
    expect(t.limits.map((l) => l.side)).toEqual(["stops-below", "stops-above"]);
    expect(t.limits[0].value).toBeCloseTo((12 - 2) / 4e-3, -1);
    expect(t.limits[0].position).toBeCloseTo(1.5 / 1100, 5);
    expect(t.limits[1].position).toBeCloseTo(767 / 1100, 5);
    const check = t.checks.find((c) => c.code === "control-crosses-limit")!;
    expect(check.message).toContain(
      "crosses the stage's limit: below 0.1 % of the travel (timingR under 2.5 kΩ) and above 69.7 % of the travel (timingR over 768 kΩ) the stage does not run.",
    );
    expect(check.message).toContain("passes at least the valley current (4 mA)");
  });

  it("says so when no position runs", () => {
    const t = analyzeTravel(
      ujt,
      { kind: "pot", field: "timingR", seriesR: 2e6, trackR: 1e6, taper: "linear" },
      3,
    );
    expect(t.checks[0].code).toBe("control-never-runs");
    expect(t.runningRange).toBeNull();
  });
});

describe("bad control input names its field", () => {
  const cases: [unknown, string][] = [
    [{ kind: "knob", field: "rb", trackR: 1e3 }, "control.kind"],
    [{ kind: "pot", field: "nope", trackR: 1e3, taper: "linear" }, "control.field"],
    [{ kind: "pot", field: "c", trackR: 1e3, taper: "linear" }, "control.field"],
    [{ kind: "pot", field: "rb", trackR: -1, taper: "linear" }, "control.trackR"],
    [{ kind: "pot", field: "rb", seriesR: -5, trackR: 1e3, taper: "linear" }, "control.seriesR"],
    [{ kind: "pot", field: "rb", trackR: 1e3, taper: "s-curve" }, "control.taper"],
    [{ kind: "selector", field: "c", values: [1e-6] }, "control.values"],
    [{ kind: "selector", field: "c", values: [1e-6, 0] }, "control.values.1"],
  ];
  for (const [control, field] of cases)
    it(`refuses ${JSON.stringify(control)} on ${field}`, () => {
      const err = expectEngineError(() => analyzeTravel(astable, control), "invalid-stage");
      expect(err.field).toBe(field);
    });
});
