// Tolerance spread: corners (every min/max combination) and seeded Monte Carlo.
import { describe, expect, it } from "vitest";
import {
  analyzeStage,
  cornerSpread,
  monteCarloSpread,
  quantile,
  seededRandom,
  spreadOf,
  type Stage,
} from "@/lib/engine";
import { fillTruncatedNormal } from "@/lib/engine/tolerance";
import { expectEngineError } from "../expect-engine-error";
import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";

function compileAndRun(source: string): string {
  const dir = mkdtempSync(path.join(tmpdir(), "clockgraft-prng-"));
  try {
    writeFileSync(path.join(dir, "ref.c"), source);
    try {
      execFileSync("gcc", ["-O1", "-o", "ref", "ref.c"], { cwd: dir, stdio: "pipe" });
    } catch (e) {
      throw new Error(`gcc is needed for this check (Debian package "gcc"): ${(e as Error).message}`);
    }
    return execFileSync(path.join(dir, "ref"), { encoding: "utf8" });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const astable: Stage = {
  kind: "timer555-astable",
  supplyV: 12,
  ra: 4.7e3,
  rb: 47e3,
  c: 1e-6,
  tolerances: { ra: 0.05, rb: 0.05, c: [0.2, 0.8] },
};

describe("Monte Carlo", () => {
  it("refuses a seed that is not a whole number, naming it", () => {
    // mulberry32-style generators take a 32-bit integer state (common practice, no source)
    const fn = (p: { r: number }) => ({ periodS: p.r, highS: p.r / 2 });
    for (const seed of [1.5, Number.NaN]) {
      const err = expectEngineError(
        () => monteCarloSpread({ r: 1 }, { r: 0.01 }, fn, { seed }),
        "invalid-stage",
        "seed",
      );
      expect(err.message).toBe("The seed must be an integer.");
    }
    expect(monteCarloSpread({ r: 1 }, { r: 0.01 }, fn, { seed: 7, samples: 10 }).seed).toBe(7);
  });

  it("same seed, same numbers; another seed, other numbers", () => {
    const a = analyzeStage(astable, { seed: 42 });
    const b = analyzeStage(astable, { seed: 42 });
    const c = analyzeStage(astable, { seed: 43 });
    expect(JSON.stringify(a.spread)).toBe(JSON.stringify(b.spread));
    expect(c.spread!.monteCarlo.periodS.median).not.toBe(a.spread!.monteCarlo.periodS.median);
    expect(a.spread!.monteCarlo.samples).toBe(10_000); // default sample count (engine.md)
    expect(a.spread!.monteCarlo.seed).toBe(42);
  });

  it("the PRNG is mulberry32 with C uint32 arithmetic (checked against the C form compiled by gcc)", () => {
    // mulberry32 as published by its author (Tommy Ettinger), written from memory.
    const src = `#include <stdio.h>
#include <stdint.h>
int main(void) { uint32_t seeds[] = {1u, 42u, 123456789u, 4000000000u};
  for (int k = 0; k < 4; k++) { uint32_t seed = seeds[k];
  uint32_t s = seed; for (int i = 0; i < 5; i++) { uint32_t z = (s += 0x6D2B79F5u);
  z = (z ^ (z >> 15)) * (z | 1u); z ^= z + (z ^ (z >> 7)) * (z | 61u);
  printf("%u ", z ^ (z >> 14)); } } return 0; }`;
    const fromC = compileAndRun(src).trim().split(" ").map(Number);
    const fromJs: number[] = [];
    for (const seed of [1, 42, 123456789, 4000000000]) {
      const r = seededRandom(seed);
      for (let i = 0; i < 5; i++) fromJs.push(r() * 2 ** 32);
    }
    expect(fromC.length).toBe(20);
    expect(fromJs).toEqual(fromC);
  });

  it("the sampler is a standard normal truncated at ±3 sigma: sd = 0.98658 (truncated-normal variance formula)", () => {
    // Var = 1 - 2*3*phi(3)/(1 - 2*Phi(-3)), phi(3) = 0.0044318, Phi(-3) = 0.0013499 (normal tables).
    const n = 200_000;
    const zs = fillTruncatedNormal(seededRandom(7), new Float64Array(n));
    let sum = 0;
    let sq = 0;
    let maxAbs = 0;
    for (let i = 0; i < n; i++) {
      const x = zs[i];
      sum += x;
      sq += x * x;
      maxAbs = Math.max(maxAbs, Math.abs(x));
    }
    const mean = sum / n;
    const sd = Math.sqrt(sq / n - mean * mean);
    expect(Math.abs(mean)).toBeLessThan(0.01);
    expect(Math.abs(sd - Math.sqrt(1 - (6 * 0.0044318) / (1 - 2 * 0.0013499)))).toBeLessThan(0.005);
    expect(maxAbs).toBeLessThanOrEqual(3);
  });

  it("quantiles and histogram are consistent with the samples", () => {
    const mc = monteCarloSpread({ x: 1 }, { x: 0.03 }, (p) => ({ periodS: p.x, highS: p.x / 2 }), {
      seed: 3,
    });
    expect(mc.histogram.counts.reduce((a, b) => a + b, 0)).toBe(10_000);
    expect(mc.histogram.binStartS).toBe(mc.sortedPeriodS[0]);
    expect(mc.periodS.median).toBeCloseTo(1, 3);
    // tolerance = 3 sigma: the 0.135 % / 99.865 % quantiles sit near ∓3 % (a little inside: truncation)
    expect(mc.periodS.q00135).toBeGreaterThan(0.97);
    expect(mc.periodS.q00135).toBeLessThan(0.975);
    expect(mc.periodS.q99865).toBeLessThan(1.03);
    expect(mc.periodS.q99865).toBeGreaterThan(1.025);
    expect(quantile([1, 2, 3, 4, 5], 0.5)).toBe(3);
    expect(quantile([1, 2, 3, 4, 5], 0.25)).toBe(2);
    expect(quantile([0, 10], 0.00135)).toBeCloseTo(0.0135, 12);
  });
});

describe("corners", () => {
  it("asymmetric capacitor tolerance -20/+80 %: period scales with C exactly", () => {
    const nominal = analyzeStage({ ...astable, tolerances: undefined });
    const s = analyzeStage({ ...astable, tolerances: { c: [0.2, 0.8] } });
    expect(s.spread!.corners.count).toBe(2);
    expect(s.spread!.corners.periodS.min).toBeCloseTo(0.8 * nominal.periodS, 12);
    expect(s.spread!.corners.periodS.max).toBeCloseTo(1.8 * nominal.periodS, 12);
  });

  it("corner extremes bracket every Monte Carlo sample for monotonic models", () => {
    const stages: Stage[] = [
      astable,
      {
        kind: "schmitt-rc",
        supplyV: 5,
        r: 100e3,
        c: 10e-9,
        vtPlus: 2.7,
        vtMinus: 1.6,
        tolerances: { supplyV: 0.1, r: 0.01, c: 0.1, vtPlus: 0.15, vtMinus: [0.2, 0.1] },
      },
      { kind: "timer555-monostable", r: 10e3, c: 1e-6, tolerances: { r: 0.01, c: 0.1 } },
      {
        kind: "ujt",
        supplyV: 20,
        timingR: 47e3,
        timingC: 100e-9,
        eta: 0.63,
        tolerances: { supplyV: 0.05, timingR: 0.05, timingC: 0.1, eta: 0.05 },
      },
    ];
    for (const stage of stages) {
      const full = { ...stage };
      const corners = spreadOf(full).corners;
      const mc = monteCarloSpread(
        full,
        stage.tolerances!,
        (p) => analyzeStage({ ...p, tolerances: undefined }),
        {
          samples: 2000,
        },
      );
      expect(mc.failed).toBe(0);
      const eps = 1e-12 * corners.periodS.max;
      expect(mc.sortedPeriodS[0]).toBeGreaterThanOrEqual(corners.periodS.min - eps);
      expect(mc.sortedPeriodS[mc.sortedPeriodS.length - 1]).toBeLessThanOrEqual(corners.periodS.max + eps);
      expect(mc.sortedHighS[0]).toBeGreaterThanOrEqual(corners.highS.min - eps);
      expect(mc.sortedHighS[mc.sortedHighS.length - 1]).toBeLessThanOrEqual(corners.highS.max + eps);
      // and the corners are really wider than the typical spread
      expect(corners.periodS.max).toBeGreaterThan(mc.periodS.q99865);
    }
  });

  it("2^n corners for n toleranced parameters", () => {
    const r = cornerSpread({ a: 1, b: 2, c: 3 }, { a: 0.1, b: 0.1, c: 0.1 }, (p) => ({
      periodS: p.a + p.b + p.c,
      highS: p.a,
    }));
    expect(r.count).toBe(8);
    expect(r.periodS.min).toBeCloseTo(5.4, 12);
    expect(r.periodS.max).toBeCloseTo(6.6, 12);
  });

  it("corners at which the stage stops are counted and warned about", () => {
    // UJT near the load-line limit: -10 % on timingR crosses (Vs - Vv)/Iv = 4.5 kΩ.
    const a = analyzeStage({
      kind: "ujt",
      supplyV: 20,
      timingR: 4.8e3,
      timingC: 1e-6,
      eta: 0.6,
      tolerances: { timingR: 0.1 },
    });
    expect(a.oscillates).toBe(true);
    expect(a.spread!.corners.failed).toBe(1);
    expect(a.spread!.monteCarlo.failed).toBeGreaterThan(0);
    expect(a.checks.map((c) => c.code)).toContain("stops-within-tolerance");
  });
});
