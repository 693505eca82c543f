// 1 000 000 samples streamed in text chunks and measured (correctness only;
// the timing belongs to the benchmark). Truth: a trapezoid train built from
// whole sample counts, so every interval is exact (IEEE Std 181-2011
// definitions as in measure-pulses.test.ts).
import { describe, expect, it } from "vitest";
import { MAX_EDGES, measureCsv } from "@/lib/capture";
import { trapezoid, trapezoidTruth, type Trapezoid } from "./fixtures/synth";

const p: Trapezoid = {
  n: 1_000_000,
  dtS: 1e-6,
  period: 400,
  delay: 37,
  rise: 8,
  top: 92,
  fall: 4,
  lowV: 0.5,
  highV: 3.3,
};

/** The CSV produced 20 000 rows at a time, never as one string. */
async function* csvChunks(): AsyncGenerator<string> {
  const { v } = trapezoid(p);
  yield "Source,synthetic trapezoid\nTime (us),Out (V)\n";
  const rows: string[] = [];
  for (let i = 0; i < p.n; i++) {
    rows.push(`${i},${v[i].toFixed(3)}`);
    if (rows.length === 20_000) {
      yield rows.join("\n") + "\n";
      rows.length = 0;
    }
  }
}

describe("one million samples", () => {
  it("are parsed and measured", async () => {
    const truth = trapezoidTruth(p);
    const m = await measureCsv(csvChunks());
    expect(m.samples).toBe(1_000_000);
    expect(m.durationS).toBeCloseTo(0.999999, 12);
    expect(m.lowLevelV).toBeCloseTo(0.5, 9);
    expect(m.highLevelV).toBeCloseTo(3.3, 9);
    // Rises at 41 us + k * 400 us: 2500 rises, 2499 periods.
    expect(m.periodS.count).toBe(2499);
    expect(m.periodS.mean).toBeCloseTo(truth.periodS, 12);
    expect(m.periodS.max - m.periodS.min).toBeLessThan(1e-9);
    expect(m.highS.mean).toBeCloseTo(truth.highS, 12);
    expect(m.duty).toBeCloseTo(truth.highS / truth.periodS, 9);
    expect(m.riseS).toBeCloseTo(truth.riseS, 12);
    expect(m.fallS).toBeCloseTo(truth.fallS, 12);
    expect(m.edgesTotal).toBe(5000);
    expect(m.edges).toHaveLength(MAX_EDGES);
    expect(m.warnings.map((w) => w.code)).toContain("edges-capped");
    expect(m.plot).toHaveLength(2000);
    expect(m.plot[1].tS).toBeCloseTo(500e-6, 12);
    expect(Math.min(...m.plot.map((q) => q.minV))).toBeCloseTo(0.5, 9);
    expect(Math.max(...m.plot.map((q) => q.maxV))).toBeCloseTo(3.3, 9);
  });
});
