// The form sub-component's reading of typed values (engineering notation,
// IEC 60062 style codes such as 2k2) into a control, and its messages.
import { describe, expect, it } from "vitest";
import { travelFor, type Draft } from "@/components/retrofit/control-fields";
import type { Stage } from "@/lib/engine";

const LN2 = Math.log(2);
const astable: Stage = { kind: "timer555-astable", supplyV: 12, ra: 1e3, rb: 10e3, c: 1e-6 };
const draft: Draft = { kind: "pot", field: "rb", seriesR: "2k2", trackR: "47k", taper: "linear", values: "" };

describe("control fields", () => {
  it("reads 2k2 + 47k and draws the 555 travel (SLFS022: T = ln2*(Ra + 2*Rb)*C)", () => {
    const r = travelFor(astable, draft, "rb");
    expect(r && "travel" in r).toBe(true);
    const t = (r as { travel: { runningRange: { maxS: number } } }).travel;
    expect(t.runningRange.maxS).toBeCloseTo(LN2 * (1e3 + 2 * 49.2e3) * 1e-6, 12);
  });
  it("names the field of a bad value", () => {
    expect(travelFor(astable, { ...draft, trackR: "4x7" }, "rb")).toEqual({
      error: expect.stringMatching(/^Track resistance: "4x7"/),
    });
    expect(travelFor(astable, { ...draft, kind: "selector", values: "1u, oops" }, "c")).toEqual({
      error: expect.stringMatching(/entry 2/),
    });
  });
  it("shows no travel for a fixed value", () => {
    expect(travelFor(astable, { ...draft, kind: "none" }, "rb")).toBeNull();
  });
});
