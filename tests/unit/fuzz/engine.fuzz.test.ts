// Property-based fuzzing (fast-check) of the engine entry points: whatever
// the input, the result carries no NaN, and the only exception is a typed
// EngineError. Seeds are fixed so a failure is reproducible.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  analyzeStage,
  isEngineError,
  listDevices,
  parseEng,
  planTarget,
  STAGE_FIELDS,
  STAGE_KINDS,
  type EngUnit,
} from "@/lib/engine";
import { nanPaths } from "./nan-paths";

/** Runs fn; returns its result, or undefined when it threw an EngineError. */
function typed<T>(fn: () => T): T | undefined {
  try {
    return fn();
  } catch (e) {
    if (isEngineError(e)) return undefined;
    throw e;
  }
}

const anyValue = fc.oneof(
  fc.double(),
  fc.double({ min: 1e-12, max: 1e6, noNaN: true }),
  fc.constantFrom(NaN, Infinity, -Infinity, 0, -0, -1, 1e308, 5e-324, Number.MAX_SAFE_INTEGER),
  fc.string({ maxLength: 8 }),
  fc.boolean(),
  fc.constant(null),
  fc.constant(undefined),
  fc.array(fc.double(), { maxLength: 2 }),
);

describe("analyzeStage", () => {
  for (const { kind } of STAGE_KINDS) {
    it(`${kind}: arbitrary field values give a NaN-free analysis or an EngineError`, () => {
      const fields = STAGE_FIELDS[kind].map((f) => f.name);
      const stage = fc.record(Object.fromEntries(fields.map((n) => [n, anyValue])), { requiredKeys: [] });
      fc.assert(
        fc.property(stage, (values) => {
          const out = typed(() => analyzeStage({ kind, ...values } as never));
          if (!out) return;
          // Contract (lib/engine/analyze-stage.ts): a stage that cannot oscillate
          // has NaN timing and an error check saying why; one that does, no NaN.
          if (out.oscillates) expect(nanPaths(out), JSON.stringify(values)).toEqual([]);
          else expect(out.checks.some((c) => c.level === "error")).toBe(true);
        }),
        { numRuns: 40, seed: 9001 },
      );
    });
  }

  it("arbitrary objects (wrong kind, wrong shape) give an EngineError", () => {
    fc.assert(
      fc.property(fc.oneof(fc.anything(), fc.record({ kind: fc.string() })), (x) => {
        typed(() => analyzeStage(x as never));
      }),
      { numRuns: 300, seed: 9002 },
    );
  });
});

describe("planTarget", () => {
  const devices = listDevices();
  const request = fc.record(
    {
      device: fc.oneof(fc.constantFrom(...devices.map((d) => d.id)), fc.string({ maxLength: 6 })),
      clockHz: fc.oneof(fc.double(), fc.constantFrom(1e6, 8e6, 16e6, 48e6, 0, -1, NaN, Infinity)),
      periodS: fc.oneof(fc.double(), fc.double({ min: 1e-6, max: 100, noNaN: true })),
      highS: fc.oneof(fc.double(), fc.double({ min: 1e-7, max: 50, noNaN: true })),
      mode: fc.constantFrom("pwm", "toggle", "isr", "x", undefined),
      timer: fc.option(
        fc.oneof(fc.string({ maxLength: 8 }), fc.constantFrom("TIMER1", "TIM2", "TIMER0_A3")),
        { nil: undefined },
      ),
      clockSource: fc.option(
        fc.oneof(fc.string({ maxLength: 6 }), fc.constantFrom("crystal", "internal", "hsi16")),
        { nil: undefined },
      ),
      clockAccuracyPpm: fc.option(fc.oneof(fc.double(), fc.constantFrom(20, 0, -5)), { nil: undefined }),
    },
    { requiredKeys: ["device", "clockHz", "periodS", "highS"] },
  );
  it("arbitrary requests give a NaN-free plan or an EngineError", () => {
    fc.assert(
      fc.property(request, (r) => {
        const plan = typed(() => planTarget(r as never));
        if (plan) expect(nanPaths(plan), JSON.stringify(r)).toEqual([]);
      }),
      { numRuns: 1500, seed: 9003 },
    );
  });
});

describe("parseEng", () => {
  const units: EngUnit[] = ["Ω", "F", "V", "A", "s", "Hz", "%", "ppm", ""];
  const text = fc.oneof(
    fc.string({ maxLength: 12 }),
    fc.string({ unit: "binary", maxLength: 12 }),
    fc.stringMatching(/^[-+]?[0-9]{0,4}[.,]?[0-9]{0,3}(e[-+]?[0-9]{1,4})?\s?[pnuµmkKMG]?[ΩFVAsHz%]{0,3}$/),
  );
  it("arbitrary strings give a finite number or an EngineError", () => {
    fc.assert(
      fc.property(text, fc.constantFrom(...units), (s, unit) => {
        const v = typed(() => parseEng(s, unit));
        if (v !== undefined) expect(Number.isFinite(v), `${JSON.stringify(s)} ${unit} -> ${v}`).toBe(true);
      }),
      { numRuns: 3000, seed: 9004 },
    );
  });
});

describe("found by fuzzing", () => {
  it("a 555 one-shot whose R x C underflows to 0 s does not oscillate (was: duty NaN)", () => {
    // ln 3 * 1e-12 * 5e-324 rounds to 0 in IEEE 754 double precision.
    const out = analyzeStage({ kind: "timer555-monostable", r: 1e-12, c: 5e-324 } as never);
    expect(out.oscillates).toBe(false);
    expect(out.checks.map((c) => c.code)).toContain("timing-out-of-range");
  });
});
