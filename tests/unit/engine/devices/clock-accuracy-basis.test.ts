// Every clock option's accuracy figure names its basis. The project's rule
// for every figure: it cites a datasheet or manual, or is
// marked "common practice" (a rule of thumb) or "from memory" (recalled, not
// checked). The budget prints this beside the figure
// (tests/unit/engine/solver/budget-clock-source.test.ts).
import { describe, expect, it } from "vitest";
import { listDevices } from "@/lib/engine";

const BASIS = /datasheet|common practice|from memory|user's guide|reference manual/i;

describe("clock accuracy figures name their basis", () => {
  for (const d of listDevices())
    it(d.id, () => {
      for (const c of d.clocks) expect(c.accuracySource, `${d.id} ${c.id}`).toMatch(BASIS);
    });
});
