// The bundle computes every register from the datasheet bit positions on its
// own; the solver does too (lib/engine/plan-types.ts). Both must agree for
// every register both name, and the C text must carry the same value.
// Sources: ATmega328P DS40002061, ATtiny25/45/85, RM0444, RP2040 datasheet,
// PIC12F1840 DS40001441, MSP430x2xx user's guide SLAU144.
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundlePlan } from "@/lib/bundle";
import { DEVICES } from "@/lib/bundle/devices";
import { planTarget } from "@/lib/engine";
import { FOLDERS, TARGETS, spec } from "./fixtures";

// solver key -> bundle write name, where the vendor has two spellings
const ALIAS: Record<string, string> = {
  TACTL: "TA0CTL",
  TACCR0: "TA0CCR0",
  TACCR1: "TA0CCR1",
  TACCTL0: "TA0CCTL0",
  TACCTL1: "TA0CCTL1",
};

describe("register values", () => {
  it.each(TARGETS.map((t, i) => [FOLDERS[i], t] as const))(
    "%s: bundle and solver agree",
    (folder, request) => {
      const plan = planTarget(request) as BundlePlan;
      const view = DEVICES[plan.device].view(plan);
      const mine = new Map(view.writes.map((w) => [w.reg, w.value]));
      let compared = 0;
      for (const [key, value] of Object.entries(plan.registers)) {
        const name = ALIAS[key] ?? key.replace(/^CH\d_/, "");
        if (mine.has(name)) {
          expect([key, mine.get(name)]).toEqual([key, value]);
          compared++;
        }
      }
      expect(compared).toBeGreaterThanOrEqual(2);
      const main = buildBundleSources(spec([request])).find((f) => f.path.endsWith("src/main.c"))!.content;
      const esc = (t: string) => t.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
      for (const w of view.writes) {
        // the comment names the formula and the final value; the statement uses the vendor's names
        expect(main).toMatch(new RegExp(`${esc(w.why)} -> 0x0*${w.value.toString(16).toUpperCase()} \\*/`));
      }
      expect(folder).toBe(FOLDERS[TARGETS.indexOf(request)]);
    },
  );
});
