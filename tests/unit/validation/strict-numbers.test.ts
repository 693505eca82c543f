// Numbers in JSON bodies are read strictly (issue 15 point 8): z.coerce ran
// Number() on anything, so [16] read as 16, true as 1 and "0x10" as 16
// (ECMAScript Number(): StringToNumber accepts hexadecimal literals, and
// ToPrimitive turns a one-element array into its element). Each of those must
// now be refused on its own field; plain decimals from the forms still read.
import { describe, expect, it, vi } from "vitest";
import { z } from "zod";
import { commentInput as commentInputForTest } from "@/lib/review/comments";
import { PLAIN_DECIMAL, plainNumber, readPlainNumber } from "@/lib/validation/plain-number";
import { listQuerySchema, planBodySchema, targetSchema } from "@/lib/validation";
import { stageSchema } from "@/lib/validation/stage";

// The comment schema sits beside its queries; no database is needed to parse.
vi.mock("@/db/client", () => ({ db: {} }));

const TARGET = { device: "atmega328p", clockSource: "crystal", clockHz: "16M", mode: "pwm" };
const COERCED = [[2], true, false, "0x10", "0b10", "0o7", "1 0", "1,5", {}, "Infinity", "1e999"];

function issuesOf(r: { success: boolean; error?: z.core.$ZodError }): Record<string, string> {
  return Object.fromEntries((r.error?.issues ?? []).map((i) => [i.path.join("."), i.message]));
}

describe("readPlainNumber", () => {
  it("reads JSON numbers and plain decimal text", () => {
    expect(readPlainNumber(2)).toBe(2);
    expect(readPlainNumber("2")).toBe(2);
    expect(readPlainNumber(" -0.5 ")).toBe(-0.5);
    expect(readPlainNumber("1e-3")).toBe(0.001);
    expect(readPlainNumber(".5")).toBe(0.5);
  });

  it("refuses what Number() would have coerced", () => {
    // Planted fault: the old reader, z.coerce.number(), accepts every one of
    // these (the check below would fail if the strict reader coerced).
    const coerce = z.coerce.number();
    for (const bad of [[2], true, "0x10", "0b10", " "]) {
      expect(coerce.safeParse(bad).success, `z.coerce accepts ${JSON.stringify(bad)}`).toBe(true);
      expect(readPlainNumber(bad), JSON.stringify(bad)).toBeNull();
    }
    for (const bad of [NaN, Infinity, "NaN", "1e999", null, undefined, {}, "4k7"])
      expect(readPlainNumber(bad), String(bad)).toBeNull();
    expect(PLAIN_DECIMAL.test("0x10")).toBe(false);
  });

  it("names what was sent", () => {
    const r = plainNumber("Pulses is a number").safeParse([3]);
    expect(r.success).toBe(false);
    expect(r.error?.issues[0].message).toBe("Pulses is a number; got a list.");
  });
});

describe("target numbers", () => {
  it.each(["clockAccuracyPpm", "requiredTolerancePct", "gateTrainPulses", "clockHz", "delayS"])(
    "%s refuses lists, booleans, hex and objects on its own field",
    (field) => {
      for (const bad of COERCED) {
        const r = targetSchema.safeParse({ ...TARGET, start: "trigger", [field]: bad });
        expect(r.success, `${field}=${JSON.stringify(bad)}`).toBe(false);
        expect(Object.keys(issuesOf(r)), `${field}=${JSON.stringify(bad)}`).toEqual([field]);
      }
    },
  );

  it("still reads the forms' text and JSON numbers", () => {
    const r = targetSchema.parse({ ...TARGET, requiredTolerancePct: "2", clockAccuracyPpm: 50 });
    expect(r.requiredTolerancePct).toBe(2);
    expect(r.clockAccuracyPpm).toBe(50);
    const blank = targetSchema.parse({ ...TARGET, requiredTolerancePct: "", clockAccuracyPpm: null });
    expect(blank.requiredTolerancePct).toBeUndefined();
    expect(blank.clockAccuracyPpm).toBeUndefined();
  });

  it("names the path inside a plan body", () => {
    const r = planBodySchema.safeParse({
      stage: { kind: "measured", periodS: "10m", highS: "2m" },
      targets: [{ ...TARGET, requiredTolerancePct: "0x10" }],
    });
    expect(issuesOf(r)).toEqual({
      "targets.0.requiredTolerancePct": 'Required tolerance is a number in percent; got "0x10".',
    });
  });
});

describe("stage values and other bodies", () => {
  it("a stage value that is a list or a boolean is refused on its field", () => {
    for (const bad of [[0.01], true, {}]) {
      const r = stageSchema.safeParse({ kind: "measured", periodS: bad, highS: "2m" });
      expect(Object.keys(issuesOf(r)), JSON.stringify(bad)).toEqual(["periodS"]);
    }
  });

  it("a comment's line is a whole number, not [3], true or 0x10", () => {
    expect(commentInputForTest.parse({ body: "x", filePath: "a.c", line: "3" }).line).toBe(3);
    for (const bad of [[3], true, "0x10"]) {
      const r = commentInputForTest.safeParse({ body: "x", filePath: "a.c", line: bad });
      expect(Object.keys(issuesOf(r)), JSON.stringify(bad)).toEqual(["line"]);
    }
  });

  it("list pages in the query are decimal", () => {
    expect(listQuerySchema.parse({}).page).toBe(1);
    expect(listQuerySchema.parse({ page: "2" }).page).toBe(2);
    expect(Object.keys(issuesOf(listQuerySchema.safeParse({ page: "0x10" })))).toEqual(["page"]);
  });
});
