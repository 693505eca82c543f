// Overlay of two revisions' emulated pin outputs (compare page). Own check of
// our drawing code, no outside source: two square waves with start-up delays
// of their own (r1: 1 ms period, 0.25 ms high, first rise at 3 ms; r2: 2 ms
// period, 0.5 ms high, first rise at 5 ms) must both start high at 0 and keep
// their own timing from there; past the last stored edge nothing is drawn.
import { describe, expect, it } from "vitest";
import { overlayOf } from "@/lib/revisions/emulation-overlay";

type Edge = { t: number; level: 0 | 1 };
function square(firstRiseS: number, periodS: number, highS: number, count: number): Edge[] {
  const out: Edge[] = [{ t: 0.0001, level: 0 }]; // start-up: the pin driven low before the timer runs
  for (let k = 0; out.length < count; k++) {
    out.push({ t: firstRiseS + k * periodS, level: 1 });
    out.push({ t: firstRiseS + k * periodS + highS, level: 0 });
  }
  return out;
}

function levelAt(points: ReturnType<typeof overlayOf>, series: "older" | "newer", t: number) {
  // the last drawn point at or before t
  let v: 0 | 1 | null = null;
  points.t.forEach((x, i) => {
    if (x <= t) v = points[series][i];
  });
  return v;
}

describe("overlayOf", () => {
  const older = square(3e-3, 1e-3, 0.25e-3, 13);
  const newer = square(5e-3, 2e-3, 0.5e-3, 13);
  const p = overlayOf(older, newer, 6e-3);

  it("starts each trace at its own first rising edge", () => {
    expect(p.t[0]).toBe(0);
    expect(p.older[0]).toBe(1);
    expect(p.newer[0]).toBe(1);
  });

  it("keeps each revision's own period and high time after that", () => {
    // r1: high in [0, 0.25) ms of each 1 ms; r2: high in [0, 0.5) ms of each 2 ms.
    expect(levelAt(p, "older", 0.2e-3)).toBe(1);
    expect(levelAt(p, "older", 0.3e-3)).toBe(0);
    expect(levelAt(p, "older", 1.1e-3)).toBe(1);
    expect(levelAt(p, "newer", 0.3e-3)).toBe(1);
    expect(levelAt(p, "newer", 0.6e-3)).toBe(0);
    expect(levelAt(p, "newer", 1.1e-3)).toBe(0);
    expect(levelAt(p, "newer", 2.1e-3)).toBe(1);
  });

  it("draws square steps: the level just before each edge is a point too", () => {
    const i = p.t.findIndex((x) => Math.abs(x - 0.25e-3) < 1e-12);
    expect(i).toBeGreaterThan(0);
    expect(p.older[i - 1]).toBe(1);
    expect(p.older[i]).toBe(0);
    expect(p.t[i] - p.t[i - 1]).toBeLessThan(1e-8);
  });

  it("draws nothing past the last stored edge, and nothing for a trace that never rose", () => {
    // r1's 13 edges: start-up + 6 periods -> last stored edge at 5.25 ms after its first rise.
    const after = p.t.map((x, i) => (x > 5.25e-3 + 1e-9 ? p.older[i] : "drawn"));
    expect(after.filter((v) => v !== "drawn").length).toBeGreaterThan(0);
    expect(after.every((v) => v === "drawn" || v === null)).toBe(true);
    expect(levelAt(p, "newer", 5.5e-3)).not.toBeNull(); // r2's 12 edges reach 10.5 ms
    const none = overlayOf([{ t: 0.001, level: 0 }], newer, 6e-3);
    expect(none.older.every((v) => v === null)).toBe(true);
    expect(none.newer[0]).toBe(1);
  });
});
