// Rows of the "numbers that changed" table that can carry a comment: every
// target quantity and register row of a real comparison must map to an anchor
// of the newer revision (lib/review/anchors.ts), and stage values, pins and
// errors must not. The revisions are the NE555 astable (TI SLFS022,
// "Astable operation": t_H = 0.693 (RA + RB) C, t_L = 0.693 RB C) with RB
// changed, planned for the ATmega328P's Timer1 in fast PWM (datasheet: TOP in
// ICR1, OCR1A sets the high time), so ICR1 and OCR1A change with RB.
import { describe, expect, it } from "vitest";
import { changedNumbers } from "@/lib/diff";
import { astableSnapshot } from "../diff/astable-snapshot";
import { anchorKeyOfNumber, revisionAnchors } from "@/lib/review/anchors";

const snapshot = astableSnapshot;

describe("comment anchors of changed-number rows", () => {
  const a = snapshot(10e3);
  const b = snapshot(4.7e3);
  const rows = changedNumbers(a, b);
  const keys = revisionAnchors(b).map((x) => x.key);

  it("maps the target's period, high time and its changed registers to the newer revision's anchors", () => {
    const mapped = rows.map((r) => anchorKeyOfNumber(r.key, keys)).filter((k): k is string => k !== null);
    expect(mapped).toContain("target1.periodS");
    expect(mapped).toContain("target1.highS");
    const regRows = rows.filter((r) => r.key.startsWith("target1.registers."));
    expect(regRows.length).toBeGreaterThan(0);
    for (const r of regRows) {
      const reg = r.key.slice("target1.registers.".length);
      // Only registers the firmware writes are anchors; a planner-only field is fine to miss.
      if (keys.includes(`target1.register.${reg}`))
        expect(anchorKeyOfNumber(r.key, keys)).toBe(`target1.register.${reg}`);
    }
    expect(mapped.some((k) => k.startsWith("target1.register."))).toBe(true);
  });

  it("gives stage values, the old stage's timing and errors no anchor", () => {
    for (const k of ["stage.rb", "analysis.periodS", "target1.periodErrorPpm", "target1.registers.NOPE"])
      expect(anchorKeyOfNumber(k, keys)).toBeNull();
  });
});
