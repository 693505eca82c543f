// How a target starts when the stage is tied to an outside event (engine.md
// section 6): a synchronised stage plans on the zero crossing with the stage's
// firing delay, a 555 one-shot on a trigger; the target can override; bundles
// for triggered starts build on every device (each has its triggered firmware); bad target
// fields get a message on the field. Logic of this product, no outside source
// beyond the section-6 contract (common practice, no source, for the defaults).
import { describe, expect, it } from "vitest";
import { analyzeStage, stageWaveform, type Stage } from "@/lib/engine";
import { buildBundleSources } from "@/lib/bundle";
import { planOne, planRequestOf, snapshotOf } from "@/lib/revisions/plan-targets";
import { targetSchema } from "@/lib/validation/target";

const heater: Stage = {
  kind: "ujt",
  supplyV: 20,
  timingR: 47e3,
  timingC: 100e-9,
  eta: 0.63,
  sync: { mainsHz: 50, mainsVrms: 230 },
};
const oneShot: Stage = { kind: "timer555-monostable", r: 100e3, c: 10e-6 };
const base = snapshotOf({
  device: "atmega328p",
  clockSource: "crystal",
  clockHz: 16e6,
  requiredTolerancePct: 1,
});

describe("start by stage", () => {
  it("synchronised stage: zero-cross at the firing delay, the half cycle as the edge interval", () => {
    const a = analyzeStage(heater);
    const req = planRequestOf(a, base);
    expect(req.start).toBe("zero-cross");
    expect(req.delayS).toBe(a.sync!.firingDelayS);
    expect(req.periodS).toBe(0.01);
    const row = planOne(a, base, 0);
    expect(row.ok).toBe(true);
  });

  it("555 monostable: a trigger by default, and it plans (no 'high time below the period' failure)", () => {
    const a = analyzeStage(oneShot);
    const row = planOne(a, base, 0);
    expect(row.ok, JSON.stringify(row)).toBe(true);
    if (row.ok) {
      expect(row.plan.start).toBe("trigger");
      expect(Math.abs(row.plan.highS - a.highS)).toBeLessThanOrEqual(row.plan.divider / 16e6);
    }
  });

  it("the target's own start, pulse and gate needs win", () => {
    const a = analyzeStage(heater);
    const t = snapshotOf({ ...base, pulseS: 50e-6, start: "zero-cross", gateMinS: 100e-6 });
    const row = planOne(a, t, 0);
    expect(row.ok).toBe(true);
    if (row.ok) {
      expect(row.plan.highS).toBeCloseTo(50e-6, 9);
      expect(row.budget!.verdict).toBe("misses");
    }
  });

  it("zero-cross on a free-running stage without an edge interval: refused, naming the field", () => {
    const a = analyzeStage({ ...heater, sync: undefined } as Stage);
    const row = planOne(a, snapshotOf({ ...base, start: "zero-cross" }), 0);
    expect(row.ok).toBe(false);
    if (!row.ok) expect(row.field).toBe("minIntervalS");
  });
});

describe("bundles for triggered starts", () => {
  it("builds the one-shot on the ATmega328P with its trigger firmware", () => {
    const a = analyzeStage(oneShot);
    const req = planRequestOf(a, base);
    const files = buildBundleSources({
      retrofit: { name: "T" },
      revision: 1,
      stage: oneShot,
      targets: [req],
    });
    const main = files.find((f) => f.path === "atmega328p/src/main.c");
    expect(String(main?.content)).toMatch(/triggered one-shot/);
  });

  it("builds the same one-shot on the PIC12F1840 with its trigger firmware (the last devices got theirs)", () => {
    const a = analyzeStage(oneShot);
    // a 32.768 kHz watch crystal: Timer2's 255 counts of 256 clocks hold the 1.1 s pulse
    const req = { ...planRequestOf(a, base), device: "pic12f1840", clockSource: "crystal", clockHz: 32768 };
    const files = buildBundleSources({
      retrofit: { name: "T" },
      revision: 1,
      stage: oneShot,
      targets: [req],
    });
    const asm = String(files.find((f) => f.path === "pic12f1840/src/main.asm")?.content);
    expect(asm).toMatch(/Triggered one-shot/);
    expect(asm).toMatch(/btfss\s+IOCAF, IOCAF1/);
  });
});

describe("sketches", () => {
  it("a one-shot shows one pulse, not a repeat", () => {
    const a = analyzeStage(oneShot);
    const w = stageWaveform(oneShot, a);
    const rises =
      w.filter((p, i) => i > 0 && p.out === 1 && w[i - 1].out === 0).length + (w[0].out === 1 ? 1 : 0);
    expect(rises).toBe(1);
  });
  it("a synchronised stage fires once per half cycle, at the firing delay", () => {
    const a = analyzeStage(heater);
    const w = stageWaveform(heater, a, 4001);
    const firstHigh = w.find((p) => p.out === 1)!;
    expect(Math.abs(firstHigh.tS - a.sync!.firingDelayS)).toBeLessThan(0.02 / 4000 + 1e-12);
    expect(w.filter((p, i) => i > 0 && p.out === 1 && w[i - 1].out === 0).length).toBe(2);
  });
});

describe("target fields: bad input names the field", () => {
  const ok = { device: "atmega328p", clockSource: "crystal", clockHz: "16M" };
  const issue = (v: object) => {
    const r = targetSchema.safeParse({ ...ok, ...v });
    return r.success ? null : r.error.issues.map((i) => i.path.join("."));
  };
  it("accepts a triggered target in engineering notation", () => {
    const r = targetSchema.safeParse({
      ...ok,
      start: "trigger",
      delayS: "2m",
      pulseS: "22u",
      retrigger: "restart",
    });
    expect(r.success).toBe(true);
    if (r.success) expect(r.data.pulseS).toBeCloseTo(22e-6, 12);
  });
  it("refuses", () => {
    expect(issue({ start: "soon" })).toEqual(["start"]);
    expect(issue({ start: "free", delayS: "1m" })).toEqual(["delayS"]);
    expect(issue({ start: "zero-cross", retrigger: "ignore" })).toEqual(["retrigger"]);
    expect(issue({ gateMinS: "100u", gateMaxS: "10u" })).toEqual(["gateMinS"]);
    expect(issue({ gateTrainPeriodS: "100u" })).toEqual(["gateTrainPulses"]);
    expect(issue({ pulseS: "-1u" })).toEqual(["pulseS"]);
  });
});
