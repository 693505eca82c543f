// The stored control of a stage: API and form read it the same way, a bad
// value is refused with a message naming its field, and a stored control reads
// back to the same form text.
import { describe, expect, it } from "vitest";
import { workspaceSchema } from "@/components/retrofit/form-values";
import type { Stage } from "@/lib/engine";
import { controlToForm, readControl } from "@/lib/validation/control";
import { updateRetrofitSchema } from "@/lib/validation/workspace";

// NE555 astable (TI SLFS022, "Astable operation"): T = ln2 * (Ra + 2 Rb) * C.
const astable: Stage = { kind: "timer555-astable", supplyV: 12, ra: 1e3, rb: 10e3, c: 1e-6 };

describe("stage control validation", () => {
  it("reads engineering text (IEC 60062 code 2k2) and SI numbers to the same control", () => {
    const text = readControl(astable, {
      kind: "pot",
      field: "rb",
      seriesR: "2k2",
      trackR: "47k",
      taper: "log",
    });
    const nums = readControl(astable, {
      kind: "pot",
      field: "rb",
      seriesR: 2200,
      trackR: 47000,
      taper: "log",
    });
    expect(text).toEqual({
      ok: true,
      control: { kind: "pot", field: "rb", seriesR: 2200, trackR: 47000, taper: "log" },
    });
    expect(nums).toEqual(text);
  });

  it("a stored control reads back to form text that gives the same control", () => {
    for (const c of [
      { kind: "pot", field: "rb", seriesR: 2200, trackR: 47000, taper: "linear" },
      { kind: "trimmer", field: "ra", seriesR: 0, trackR: 4700 },
      { kind: "selector", field: "c", values: [1e-7, 2.2e-7, 4.7e-7] },
    ] as const) {
      const r = readControl(astable, controlToForm(c));
      expect(r.ok && r.control).toEqual(c);
    }
    expect(readControl(astable, controlToForm(null))).toEqual({ ok: true, control: null });
  });

  it("names the field of each bad value", () => {
    const cases: [unknown, string][] = [
      [{ kind: "knob", field: "rb" }, "control.kind"],
      [{ kind: "pot", field: "supplyV", trackR: "47k", taper: "linear" }, "control.field"],
      [{ kind: "pot", field: "rb", trackR: "4x7", taper: "linear" }, "control.trackR"],
      [{ kind: "pot", field: "rb", trackR: "", taper: "linear" }, "control.trackR"],
      [{ kind: "pot", field: "rb", seriesR: "-1k", trackR: "47k", taper: "linear" }, "control.seriesR"],
      [{ kind: "pot", field: "rb", trackR: "47k", taper: "s-curve" }, "control.taper"],
      [{ kind: "selector", field: "c", values: "1u, oops" }, "control.values.1"],
      [{ kind: "selector", field: "c", values: "1u" }, "control.values"],
    ];
    for (const [raw, field] of cases) {
      const r = readControl(astable, raw);
      expect(r.ok, JSON.stringify(raw)).toBe(false);
      expect(!r.ok && r.field).toBe(field);
    }
  });

  it("the PATCH body refuses a bad control on its path and a control without its stage", () => {
    const bad = updateRetrofitSchema.safeParse({
      stage: astable,
      control: { kind: "pot", field: "rb", trackR: "4x7", taper: "linear" },
    });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues.map((i) => i.path.join("."))).toEqual(["control.trackR"]);
    const alone = updateRetrofitSchema.safeParse({
      control: { kind: "trimmer", field: "rb", trackR: "10k" },
    });
    expect(alone.error?.issues.map((i) => i.path.join("."))).toEqual(["control"]);
    const clear = updateRetrofitSchema.parse({ stage: astable, control: null });
    expect(clear.control).toBeNull();
    const none = updateRetrofitSchema.parse({ stage: astable });
    expect("control" in none).toBe(false);
  });

  it("the workspace form carries the control with the stage", () => {
    const out = workspaceSchema.parse({
      stage: { kind: "timer555-astable", supplyV: "12", ra: "1k", rb: "10k", c: "1u", tolerances: {} },
      control: { kind: "trimmer", field: "rb", seriesR: "", trackR: "10k", taper: "linear", values: "" },
      targets: [],
    });
    expect(out.control).toEqual({ kind: "trimmer", field: "rb", seriesR: 0, trackR: 10000 });
  });
});
