// Fuzzing that reaches the middle: generators make stages, plan requests and
// capture texts a practitioner would really enter (parts within their usual
// ranges, related fields kept in order), then perturb them a little. Each
// test counts how many inputs the engine or the reader accepted, prints the
// fraction and asserts that most passed validation, so the properties below
// are checked on real work and not only on refusals. Seeds are fixed.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { isCaptureError, measureCsv } from "@/lib/capture";
import { analyzeStage, isEngineError, listDevices, planTarget, type PlanRequest } from "@/lib/engine";
import { gaussian, toCsv, trapezoid, trapezoidTruth } from "../capture/fixtures/synth";
import { nanPaths } from "./nan-paths";

/** Log-uniform between a and b: equal chance per decade (fc.double would crowd near one end). */
const logU = (a: number, b: number) =>
  fc.integer({ min: 0, max: 1_000_000 }).map((i) => a * (b / a) ** (i / 1_000_000));
const uni = (a: number, b: number) =>
  fc.integer({ min: 0, max: 1_000_000 }).map((i) => a + ((b - a) * i) / 1e6);

/** A small nudge of one value (typing slips and part tolerance), sometimes none. */
const nudge = fc.constantFrom(1, 1, 1, 0.99, 1.01, 0.9, 1.1, 0.5, 2);

function typed<T>(fn: () => T): T | undefined {
  try {
    return fn();
  } catch (e) {
    if (isEngineError(e)) return undefined;
    throw e;
  }
}

function tally() {
  let tried = 0;
  let accepted = 0;
  return {
    count(ok: boolean) {
      tried++;
      if (ok) accepted++;
    },
    report(what: string, atLeast: number) {
      const frac = accepted / tried;
      console.log(`${what}: ${accepted} of ${tried} accepted (${(100 * frac).toFixed(1)} %)`);
      expect(tried).toBeGreaterThan(0);
      expect(frac, `${what}: accepted fraction`).toBeGreaterThanOrEqual(atLeast);
    },
  };
}

// Part ranges an old timing board really has (common practice, no source):
// 1 kΩ..1 MΩ timing resistors, 10 nF..100 µF timing capacitors.
const R = logU(1e3, 1e6);
const C = logU(10e-9, 100e-6);

/** Valid stages of each kind, with their textbook period where it has a closed form. */
const stages = fc.oneof(
  // NE555 astable (TI NE555 datasheet SLFS022, "astable operation": tH = 0.693 (RA+RB) C,
  // tL = 0.693 RB C; 0.693 is ln 2, the charge between 1/3 and 2/3 of the supply).
  fc.record({ supplyV: uni(4.5, 16), ra: R, rb: R, c: C }).map((s) => ({
    stage: { kind: "timer555-astable", ...s },
    highS: Math.LN2 * (s.ra + s.rb) * s.c,
    lowS: Math.LN2 * s.rb * s.c,
  })),
  // NE555 one-shot (SLFS022, "monostable operation": tw = 1.1 RC; 1.1 is ln 3).
  fc.record({ r: R, c: C }).map((s) => ({
    stage: { kind: "timer555-monostable", ...s },
    highS: Math.log(3) * s.r * s.c,
    lowS: undefined,
  })),
  // Schmitt-trigger RC astable: first-order RC charge between the two
  // thresholds (any circuit-analysis textbook, first-order step response):
  // tH = RC ln((Vs - Vt-)/(Vs - Vt+)), tL = RC ln(Vt+/Vt-).
  fc.record({ supplyV: uni(3, 15), lo: uni(0.2, 0.45), hi: uni(0.55, 0.8), r: R, c: C }).map((s) => {
    const vtMinus = s.lo * s.supplyV;
    const vtPlus = s.hi * s.supplyV;
    return {
      stage: { kind: "schmitt-rc", supplyV: s.supplyV, r: s.r, c: s.c, vtPlus, vtMinus },
      highS: s.r * s.c * Math.log((s.supplyV - vtMinus) / (s.supplyV - vtPlus)),
      lowS: s.r * s.c * Math.log(vtPlus / vtMinus),
    };
  }),
  // UJT relaxation oscillator (2N2646 class: eta 0.56..0.75, 10..30 V supply).
  fc
    .record({ supplyV: uni(10, 30), timingR: logU(3.3e3, 470e3), timingC: C, eta: uni(0.56, 0.75) })
    .map((s) => ({
      stage: { kind: "ujt", ...s },
      highS: undefined,
      lowS: undefined,
    })),
  // Neon / threshold stage: trip and release well inside the supply.
  fc
    .record({
      supplyV: uni(90, 300),
      peak: uni(0.3, 0.7),
      valley: uni(0.3, 0.8),
      timingR: logU(100e3, 10e6),
      timingC: logU(10e-9, 1e-6),
    })
    .map((s) => ({
      stage: {
        kind: "threshold",
        supplyV: s.supplyV,
        timingR: s.timingR,
        timingC: s.timingC,
        peakV: s.peak * s.supplyV,
        valleyV: s.valley * s.peak * s.supplyV,
        dischargeR: 100,
      },
      highS: undefined,
      lowS: undefined,
    })),
  // A measured old stage: period and pulse from the technician's scope.
  fc.record({ periodS: logU(100e-6, 10), duty: uni(0.02, 0.98) }).map((s) => ({
    stage: { kind: "measured", periodS: s.periodS, highS: s.duty * s.periodS },
    highS: s.duty * s.periodS,
    lowS: (1 - s.duty) * s.periodS,
  })),
);

describe("valid stages, then perturbed", () => {
  it("most are accepted; accepted ones are NaN-free, add up, and match the closed forms", () => {
    const t = tally();
    fc.assert(
      fc.property(stages, nudge, fc.nat(8), (g, k, which) => {
        const stage: Record<string, unknown> = { ...g.stage };
        // perturb one numeric field (the nudge is 1 in a third of the runs)
        const keys = Object.keys(stage).filter((x) => typeof stage[x] === "number");
        const key = keys[which % keys.length];
        stage[key] = (stage[key] as number) * k;
        const out = typed(() => analyzeStage(stage as never));
        t.count(out !== undefined && out.oscillates);
        if (!out) return;
        if (!out.oscillates) {
          expect(out.checks.some((c) => c.level === "error")).toBe(true);
          return;
        }
        expect(nanPaths(out), JSON.stringify(stage)).toEqual([]);
        expect(out.periodS).toBeGreaterThan(0);
        expect(out.duty).toBeGreaterThan(0);
        // a one-shot gives its pulse per trigger, without a period of its own
        if (stage.kind !== "timer555-monostable") {
          expect(out.duty).toBeLessThan(1);
          expect(Math.abs(out.highS + out.lowS - out.periodS) / out.periodS).toBeLessThan(1e-12);
          expect(Math.abs(out.frequencyHz * out.periodS - 1)).toBeLessThan(1e-12);
        }
        // closed forms hold only for the unperturbed stage
        if (k === 1 && g.highS !== undefined) {
          expect(Math.abs(out.highS / g.highS - 1), JSON.stringify(stage)).toBeLessThan(1e-9);
          if (g.lowS !== undefined) expect(Math.abs(out.lowS / g.lowS - 1)).toBeLessThan(1e-9);
        }
      }),
      { numRuns: 600, seed: 9201 },
    );
    t.report("stages", 0.8);
  });
});

// Plan requests: a device, one of its own clock options, a period of
// 100 µs..1 s drawn per decade, a duty of 5..95 %, and sometimes a mode.
const devices = listDevices();
const clockOf = (d: (typeof devices)[number]) =>
  fc.constantFrom(...d.clocks).chain((c) => {
    const list = c.frequenciesHz?.length ? c.frequenciesHz : c.hz ? [c.hz] : undefined;
    const hz = list ? fc.constantFrom(...list) : logU(c.minHz ?? d.minClockHz, c.maxHz ?? d.maxClockHz);
    return hz.map((clockHz) => ({ clockSource: c.id, clockHz }));
  });
const requests = fc.constantFrom(...devices).chain((d) =>
  fc
    .record({
      clock: clockOf(d),
      periodS: logU(100e-6, 1),
      duty: uni(0.05, 0.95),
      mode: fc.constantFrom(
        undefined,
        "pwm",
        "isr",
        ...(d.timers.some((x) => x.modes.includes("toggle")) ? ["toggle" as const] : []),
      ),
      k: nudge,
    })
    .map((r): PlanRequest => ({
      device: d.id,
      ...r.clock,
      periodS: r.periodS * r.k,
      // toggle gives a 50 % output; ask for what it can make
      highS: r.mode === "toggle" ? r.periodS * r.k * 0.5 : r.periodS * r.duty,
      ...(r.mode ? { mode: r.mode } : {}),
    })),
);

describe("valid plan requests, then perturbed", () => {
  it("most are planned; a plan's period and high time follow from its own counts", () => {
    const t = tally();
    const decades = new Map<number, number>();
    fc.assert(
      fc.property(requests, (r) => {
        decades.set(
          Math.floor(Math.log10(r.periodS)),
          (decades.get(Math.floor(Math.log10(r.periodS))) ?? 0) + 1,
        );
        const p = typed(() => planTarget(r));
        t.count(p !== undefined);
        if (!p) return;
        expect(nanPaths(p), JSON.stringify(r)).toEqual([]);
        // engine.md section 4: periodS = periodCountsTotal / clockHz, and
        // periodCountsTotal = divider * periodCounts * modeFactor * softwareDivider
        if (p.start === undefined || p.start === "free") {
          const total = p.divider * p.periodCounts * p.modeFactor * p.softwareDivider;
          expect(Math.abs(p.periodCountsTotal / total - 1)).toBeLessThan(1e-12);
          expect(Math.abs((p.periodS * p.clockHz) / p.periodCountsTotal - 1)).toBeLessThan(1e-12);
        }
        expect(
          Math.abs(p.periodErrorPpm - ((p.periodS - p.targetPeriodS) / p.targetPeriodS) * 1e6),
        ).toBeLessThan(1e-3);
        expect(p.highS).toBeGreaterThan(0);
        expect(p.highS).toBeLessThanOrEqual(p.periodS);
        expect(p.targetPeriodS).toBe(r.periodS);
      }),
      { numRuns: 400, seed: 9202 },
    );
    console.log(
      "requested periods per decade (log10 s):",
      Object.fromEntries([...decades].sort((a, b) => a[0] - b[0])),
    );
    // log-uniform over 4 decades: none of them empty
    for (const dec of [-4, -3, -2, -1]) expect(decades.get(dec) ?? 0).toBeGreaterThan(40);
    t.report("plan requests", 0.8);
  });
});

// Capture texts: a trapezoid pulse train with known timing and noise,
// written the way scopes export it, then perturbed (line ends, delimiter,
// metadata lines, a DC offset, a time origin before the trigger).
const captures = fc.record({
  period: fc.integer({ min: 40, max: 400 }),
  dutyPct: fc.integer({ min: 15, max: 85 }),
  cycles: fc.integer({ min: 3, max: 8 }),
  dtExp: fc.integer({ min: -7, max: -3 }),
  lowV: uni(-1, 1),
  amp: uni(1, 12),
  noisePct: uni(0, 1),
  seed: fc.nat(1 << 20),
  eol: fc.constantFrom("\n", "\r\n"),
  delim: fc.constantFrom(",", "\t", ";"),
  meta: fc.boolean(),
  t0: fc.constantFrom(0, -0.25),
});

describe("valid capture texts, then perturbed", () => {
  it("most are measured; period and high time match the trace they came from", async () => {
    const t = tally();
    await fc.assert(
      fc.asyncProperty(captures, async (c) => {
        const rise = Math.max(2, Math.round(c.period / 40));
        const top = Math.round((c.period * c.dutyPct) / 100) - rise;
        const spec = {
          n: c.period * c.cycles,
          dtS: 10 ** c.dtExp,
          period: c.period,
          delay: Math.round(c.period / 3),
          rise,
          top,
          fall: rise,
          lowV: c.lowV,
          highV: c.lowV + c.amp,
        };
        const { t: time, v } = trapezoid(spec);
        const noise = gaussian(c.seed);
        for (let i = 0; i < v.length; i++) v[i] += ((c.noisePct / 100) * c.amp * noise()) / 3;
        const origin = c.t0 * spec.n * spec.dtS;
        for (let i = 0; i < time.length; i++) time[i] += origin;
        const header = [
          ...(c.meta ? ["Sample Interval" + c.delim + spec.dtS, "Record Length" + c.delim + spec.n] : []),
          `Time (s)${c.delim}CH1 (V)`,
        ];
        const text = toCsv([time, v], { header, delimiter: c.delim }).replaceAll("\n", c.eol);
        let m;
        try {
          m = await measureCsv(text, { maxBytes: 1 << 22 });
        } catch (e) {
          if (!isCaptureError(e)) throw e;
        }
        t.count(m !== undefined && m.periodS.count > 0);
        if (!m || m.periodS.count === 0) return;
        const truth = trapezoidTruth(spec);
        // IEEE 181-2011 5.3.3 (pulse duration) and 5.3.2 (period) at the 50 %
        // level; noise of 1 % of the amplitude on an edge of >= 2 samples moves a
        // crossing by well under a sample, so one sample interval bounds it.
        expect(Math.abs(m.periodS.mean - truth.periodS)).toBeLessThan(spec.dtS);
        expect(Math.abs(m.highS.mean - truth.highS)).toBeLessThan(spec.dtS);
        expect(Math.abs(m.lowLevelV - spec.lowV)).toBeLessThan(0.02 * c.amp);
        expect(Math.abs(m.highLevelV - spec.highV)).toBeLessThan(0.02 * c.amp);
      }),
      { numRuns: 120, seed: 9203 },
    );
    t.report("capture texts", 0.8);
  });
});
