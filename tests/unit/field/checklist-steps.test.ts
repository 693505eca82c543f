// The phone's checklist steps are read from every golden bundle's CHECKLIST.md:
// each box and each check-table row becomes one step (counted here from the
// raw text independently of the parser), the period/high limits read back
// from the printed cells agree with plan.json's limits to the printed digits,
// and the safety boxes carry the mains/thyristor cautions.
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { checklistSteps, rangeOf } from "@/lib/field/checklist-steps";

const GOLDEN = join(process.cwd(), "tests/golden");

type Limit = { id: string; min: number; max: number; derived: boolean };
type Target = { folder: string; limits: Limit[] };

function bundles(): { name: string; targets: Target[]; dir: string }[] {
  return readdirSync(GOLDEN)
    .filter((d) => statSync(join(GOLDEN, d)).isDirectory())
    .map((d) => {
      const plan = JSON.parse(readFileSync(join(GOLDEN, d, "plan.json"), "utf8")) as { targets: Target[] };
      return { name: d, targets: plan.targets, dir: join(GOLDEN, d) };
    });
}

describe("checklist steps from CHECKLIST.md", () => {
  const all = bundles();
  it("finds golden bundles to read", () => {
    expect(all.length).toBeGreaterThan(5);
  });

  for (const b of all) {
    it(`${b.name}: one step per box and per check row, limits as plan.json`, () => {
      for (const t of b.targets) {
        const md = readFileSync(join(b.dir, t.folder, "CHECKLIST.md"), "utf8");
        const steps = checklistSteps(md);
        // Independent count: every "[ ]" box (lists and Pass cells) and every "information" Pass cell.
        const boxes = md.match(/\[ \]/g)?.length ?? 0;
        const info = md.match(/\| information \|$/gm)?.length ?? 0;
        expect(steps.filter((s) => s.kind !== "info").length).toBe(boxes);
        expect(steps.filter((s) => s.kind === "info").length).toBe(info);
        expect(new Set(steps.map((s) => s.id)).size).toBe(steps.length);

        for (const id of ["period", "high"] as const) {
          const want = t.limits.find((l) => l.id === id)!;
          const bench = steps.find((s) => s.from === id)!;
          expect(bench, `${t.folder} ${id}`).toBeDefined();
          // The cells print 7 significant digits (formatEng), so agree to 1e-6 relative.
          expect(Math.abs(bench.range!.min - want.min) / want.min).toBeLessThan(1e-6);
          expect(Math.abs(bench.range!.max - want.max) / want.max).toBeLessThan(1e-6);
          const site = steps.find(
            (s) =>
              s.id.startsWith("S") && s.range && s.text.startsWith(id === "period" ? "Period" : "High time"),
          );
          expect(site?.range).toEqual(bench.range);
        }
        for (const s of steps) expect(s.text).not.toMatch(/<br>|`|\\\(/);
      }
    });
  }

  it("marks the safety boxes of a mains-synchronised thyristor retrofit", () => {
    const md = readFileSync(join(GOLDEN, "zero-cross-avr/atmega328p/CHECKLIST.md"), "utf8");
    const safety = checklistSteps(md).filter((s) => s.safety);
    expect(safety.some((s) => /Isolate the supply and lock it out/.test(s.text))).toBe(true);
    expect(safety.some((s) => /thyristor gate/.test(s.text))).toBe(true);
    expect(safety.some((s) => /Local electrical codes and licensed practice/.test(s.text))).toBe(true);
  });

  it("reads a limits cell only when both ends carry the same unit", () => {
    expect(rangeOf("9.897938 ms … 10.10206 ms<br>limit from: plan")).toEqual({
      min: 9.897938e-3,
      max: 10.10206e-3,
      unit: "s",
    });
    expect(rangeOf("—")).toBeUndefined();
    expect(rangeOf("exactly one")).toBeUndefined();
    expect(rangeOf("1 ms … 2 Hz")).toBeUndefined();
    expect(rangeOf("2 ms … 1 ms")).toBeUndefined();
  });
});
