// findTransitions on hand-built traces, expected values worked out here from
// IEEE Std 181-2011 definitions: a transition's instant is where it crosses
// the 50 % reference level (5.3.3.1), its duration the interval between the
// 10 % and 90 % reference level instants (5.3.3.2); a transition is only
// counted once the waveform has gone from one state to the other (3.1,
// "transition"; the 10 % / 90 % levels serve as the hysteresis). Instants
// between samples are linear interpolations. Levels here: 0..10 V, so the
// references are 1 V, 5 V and 9 V; one sample per second.
import { describe, expect, it } from "vitest";
import { findTransitions } from "@/lib/capture/transitions";

const REF = { p10: 1, p50: 5, p90: 9 };
const run = (v: number[]) =>
  findTransitions(
    Float64Array.from(v, (_, i) => i),
    Float64Array.from(v),
    REF,
  );

describe("findTransitions (IEEE 181-2011 5.3.3)", () => {
  it("a 2 V/s ramp up and down: 50 % instants 4.5 s and 11.5 s, 10-90 % durations 4 s", () => {
    // rise: 0 V at t = 2 s, +2 V per s: 1 V at 2.5 s, 5 V at 4.5 s, 9 V at 6.5 s
    // fall: 10 V at t = 9 s, -2 V per s: 9 V at 9.5 s, 5 V at 11.5 s, 1 V at 13.5 s
    const v = [0, 0, 0, 2, 4, 6, 8, 10, 10, 10, 8, 6, 4, 2, 0, 0];
    expect(run(v)).toEqual([
      { kind: "rise", t50: 4.5, duration: 4 },
      { kind: "fall", t50: 11.5, duration: 4 },
    ]);
  });

  it("a runt pulse that crosses 50 % but not 90 % is no transition", () => {
    const v = [0, 0, 3, 6, 3, 0, 0, 10, 10];
    // only the full step at the end: 0 V at 6 s to 10 V at 7 s: 50 % at 6.5 s, 1 V .. 9 V in 0.8 s
    const out = run(v);
    expect(out).toHaveLength(1);
    expect(out[0].kind).toBe("rise");
    expect(out[0].t50).toBeCloseTo(6.5, 12);
    expect(out[0].duration).toBeCloseTo(0.8, 12);
  });

  it("a negative runt from the high state is no transition either", () => {
    const v = [10, 10, 7, 4, 7, 10, 10, 0, 0];
    const out = run(v);
    expect(out).toHaveLength(1);
    expect(out[0].kind).toBe("fall");
    expect(out[0].t50).toBeCloseTo(6.5, 12);
    expect(out[0].duration).toBeCloseTo(0.8, 12);
  });

  it("the first edge of a trace that starts between the states is not counted (no state to leave)", () => {
    // starts at 5 V: reaching 9 V only establishes the high state; the fall is the first transition
    const out = run([5, 7, 10, 10, 6, 2, 0, 0]);
    expect(out.map((x) => x.kind)).toEqual(["fall"]);
    // fall: 10 V at 3 s, 6 V at 4 s, 2 V at 5 s, 0 V at 6 s: 9 V at 3.25 s, 5 V at 4.25 s, 1 V at 5.5 s
    expect(out[0].t50).toBeCloseTo(4.25, 12);
    expect(out[0].duration).toBeCloseTo(5.5 - 3.25, 12);
  });

  it("a trace starting in the high state counts no rise before its first fall", () => {
    const out = run([10, 10, 0, 0, 10]);
    expect(out.map((x) => x.kind)).toEqual(["fall", "rise"]);
    expect(out[0].t50).toBeCloseTo(1.5, 12);
    expect(out[1].t50).toBeCloseTo(3.5, 12);
  });

  it("a rise that wobbles back across 50 % takes its last 50 % crossing before 90 % (our rule)", () => {
    // 0, 6, 4, 8, 10: 50 % crossed up at 0.83 s, down at 1.5 s, up again at 2.25 s
    const out = run([0, 6, 4, 8, 10]);
    expect(out).toHaveLength(1);
    expect(out[0].t50).toBeCloseTo(2.25, 12);
    // 10 %: last crossing before that, 0 -> 6 V at 1/6 s; 90 %: 8 -> 10 V at 3.5 s
    expect(out[0].duration).toBeCloseTo(3.5 - 1 / 6, 12);
  });

  it("a fall that wobbles back takes its last 50 % crossing too", () => {
    const out = run([10, 10, 4, 6, 2, 0]);
    // 10 -> 4 V crosses 9 V at 1 + 1/6 s; 6 -> 2 V crosses 5 V at 3.25 s, 1 V: 2 -> 0 at 4.5 s
    expect(out).toHaveLength(1);
    expect(out[0].kind).toBe("fall");
    expect(out[0].t50).toBeCloseTo(3.25, 12);
    expect(out[0].duration).toBeCloseTo(4.5 - (1 + 1 / 6), 12);
  });

  it("samples exactly on a reference level do not change the state", () => {
    // 9 V is not above 90 %, 1 V not below 10 %
    expect(run([0, 9, 9, 1, 1, 9, 0])).toEqual([]);
  });

  it("unevenly spaced samples interpolate in time", () => {
    const t = Float64Array.from([0, 1, 1.5, 4]);
    const v = Float64Array.from([0, 0, 10, 10]);
    const [r] = findTransitions(t, v, REF);
    expect(r.t50).toBeCloseTo(1.25, 12);
    expect(r.duration).toBeCloseTo(0.4, 12);
  });
});
