// The Schmitt-inverter RC astable's charge sketch: the capacitor charges from
// VT- toward the supply and discharges from VT+ toward 0 V through the same
// R·C, and each segment ends at the other threshold after the half-period.
import { describe, expect, it } from "vitest";
import { schmittRcModel } from "@/lib/engine/stages/schmitt-rc";

describe("Schmitt RC astable sketch", () => {
  it("charges and discharges with tau = R C and ends on the thresholds", () => {
    // First-order RC step response: v(t) = v_end + (v_start - v_end) e^(-t / (R C)).
    const s = { kind: "schmitt-rc" as const, supplyV: 5, r: 100e3, c: 10e-9, vtPlus: 2.7, vtMinus: 1.6 };
    const r = schmittRcModel.evaluate(s);
    const sketch = schmittRcModel.segments!(s, r);
    if (sketch === null) throw new Error("no sketch");
    const [up, down] = sketch.segments;
    const at = (seg: typeof up) => seg.toward + (seg.from - seg.toward) * Math.exp(-seg.durationS / seg.tauS);
    expect(up.tauS).toBeCloseTo(s.r * s.c, 15);
    expect(down.tauS).toBeCloseTo(s.r * s.c, 15);
    expect(at(up)).toBeCloseTo(s.vtPlus, 9);
    expect(at(down)).toBeCloseTo(s.vtMinus, 9);
    expect([up.out, down.out]).toEqual([1, 0]);
  });
});
