// Field labels are the form's product text (engine.md section 4: field lists
// for forms). Each field needs a label of its own so a form can name it
// (common practice, no source); the 555 astable's labels name the parts by the
// NE555 datasheet's pins and circuit (TI SLFS022, astable operation: RA from
// VCC to DISCHARGE, RB from DISCHARGE to THRESHOLD/TRIGGER, C from there to
// GND; CONT is pin 5).
import { describe, expect, it } from "vitest";
import * as engine from "@/lib/engine";

describe("stage field labels", () => {
  it("every field of every stage kind has a label of its own", () => {
    for (const k of engine.STAGE_KINDS) {
      const labels = engine.STAGE_FIELDS[k.kind].map((f) => f.label.trim());
      for (const [i, label] of labels.entries()) {
        expect(label.length, `${k.kind}.${engine.STAGE_FIELDS[k.kind][i].name}`).toBeGreaterThan(0);
      }
      expect(new Set(labels).size, k.kind).toBe(labels.length);
    }
  });

  it("the 555 astable's labels name RA, RB, the timing capacitor and pin 5 as the datasheet does", () => {
    const label = (name: string) =>
      engine.STAGE_FIELDS["timer555-astable"].find((f) => f.name === name)?.label ?? "";
    expect(label("ra")).toMatch(/^RA\b.*VCC.*discharge/i);
    expect(label("rb")).toMatch(/^RB\b.*discharge.*threshold/i);
    expect(label("c")).toMatch(/capacitor/i);
    expect(label("controlV")).toMatch(/control.*pin 5/i);
  });
});
