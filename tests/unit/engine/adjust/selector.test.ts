import { describe, expect, it } from "vitest";
import { buildSelectorTable, type Stage } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

// 555 astable, T = ln2*(Ra + 2*Rb)*C (NE555 datasheet, TI SLFS022): a selector
// of timing capacitors scales the period by C.
const astable: Stage = { kind: "timer555-astable", supplyV: 12, ra: 1e3, rb: 10e3, c: 1e-6 };
const selector = { kind: "selector", field: "c", values: [100e-9, 220e-9, 470e-9, 1e-6] };

describe("selector switch on input pins", () => {
  const t = buildSelectorTable({ stage: astable, control: selector, device: "atmega328p", clockHz: 16e6 });
  it("gives every position the datasheet period within half a count, one divider for all", () => {
    const count = t.plan.divider / 16e6;
    expect(t.inputPins).toBe(4);
    for (const p of t.positions) {
      expect(p.wantS / (Math.log(2) * 21e3 * p.value)).toBeCloseTo(1, 9);
      expect(Math.abs(p.periodS - p.wantS)).toBeLessThanOrEqual(count / 2 + 1e-15);
    }
    expect(t.positions[3].periodCounts).toBe(t.plan.periodCounts);
  });
  it("names the position that does not run", () => {
    // UJT load line: R below (Vs - Vp)/Ip (General Electric SCR Manual, from memory); 1 MΩ is above 768 kΩ
    const ujt: Stage = { kind: "ujt", supplyV: 12, timingR: 47e3, timingC: 1e-6, eta: 0.63 };
    const err = expectEngineError(
      () =>
        buildSelectorTable({
          stage: ujt,
          control: { kind: "selector", field: "timingR", values: [47e3, 1e6] },
          device: "atmega328p",
          clockHz: 16e6,
        }),
      "invalid-request",
    );
    expect(err.field).toBe("control.values.1");
    // Positions are counted from 1 as printed on a switch; the stage's own reason follows.
    expect(err.message).toMatch(
      /^Selector position 2 \(timingR = 1000000\) does not run: Timing resistor 1 MΩ /,
    );
    expect(err.message).toContain("the UJT never fires");
  });
});
