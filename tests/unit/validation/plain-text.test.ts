// Plain text guards (issue 15 point 8): line breaks in single-line text and
// the bidirectional embedding/override/isolate controls of Unicode Standard
// Annex #9 ("Explicit Directional Formatting Characters": LRE U+202A, RLE
// U+202B, PDF U+202C, LRO U+202D, RLO U+202E, LRI U+2066, RLI U+2067, FSI
// U+2068, PDI U+2069) anywhere.
import { describe, expect, it, vi } from "vitest";
import {
  BIDI_CONTROLS,
  cleanLine,
  lineText,
  paragraphText,
  plainTextProblem,
} from "@/lib/validation/plain-text";
import { retrofitFactsSchema, tokenBodySchema } from "@/lib/validation";

vi.mock("@/db/client", () => ({ db: {} }));

const BIDI = [0x202a, 0x202b, 0x202c, 0x202d, 0x202e, 0x2066, 0x2067, 0x2068, 0x2069].map((c) =>
  String.fromCodePoint(c),
);
const BREAKS = ["\n", "\r", "\r\n", "\u0085", "\u2028", "\u2029"];

describe("plainTextProblem", () => {
  it("names each bidi control by its code point, in any text", () => {
    for (const c of BIDI) {
      const problem = plainTextProblem(`invoice${c}fdp.exe`, "Name", { singleLine: false });
      expect(problem, c).toContain(`U+${c.codePointAt(0)!.toString(16).toUpperCase()}`);
    }
  });

  it("leaves the characters next to the ranges alone", () => {
    // U+2029 ends one range's neighbour, U+202F (narrow no-break space) and
    // U+2065 (unassigned) / U+206A (deprecated inhibit) sit just outside.
    for (const c of ["\u2029", "\u202f", "\u2065", "\u206a", "\u200f", "é", "Ω"])
      expect(BIDI_CONTROLS.test(c), c.codePointAt(0)!.toString(16)).toBe(false);
  });

  it("refuses line breaks only in single-line text", () => {
    for (const b of BREAKS) {
      expect(plainTextProblem(`a${b}b`, "Name", { singleLine: true }), JSON.stringify(b)).toBe(
        "Name must be on one line (no line breaks).",
      );
      expect(plainTextProblem(`a${b}b`, "Notes", { singleLine: false })).toBeNull();
    }
  });
});

describe("schemas", () => {
  it("one-line fields refuse breaks and bidi controls; trimmed edges are fine", () => {
    const s = lineText("Site", { min: 1, max: 50 });
    expect(s.parse("  Pump house 2 \n")).toBe("Pump house 2");
    expect(s.safeParse("Pump\nhouse").success).toBe(false);
    expect(s.safeParse("Pump \u202Eesuoh").success).toBe(false);
    const p = paragraphText("Notes", { max: 50 });
    expect(p.parse("line 1\nline 2")).toBe("line 1\nline 2");
    expect(p.safeParse("line 1\n\u2067x\u2069").success).toBe(false);
  });

  it("a retrofit's name and a token's name are on one line; its description may span lines", () => {
    const facts = { name: "Kiln timer", site: "North", assetTag: "K-1" };
    expect(retrofitFactsSchema.parse({ ...facts, description: "a\nb" }).description).toBe("a\nb");
    const bad = retrofitFactsSchema.safeParse({ ...facts, name: "Kiln\r\nSite: forged" });
    expect(bad.error?.issues.map((i) => [i.path.join("."), i.message])).toEqual([
      ["name", "Name must be on one line (no line breaks)."],
    ]);
    const desc = retrofitFactsSchema.safeParse({ ...facts, description: "ok \u202E" });
    expect(desc.error?.issues.map((i) => i.path.join("."))).toEqual(["description"]);
    expect(tokenBodySchema.safeParse({ name: "bench\nlaptop" }).success).toBe(false);
  });

  it("the field check's signature and notes follow the same rule", async () => {
    const { fieldCheckSchema } = await import("@/lib/field/record-check");
    const base = { revisionId: 1, measuredPeriodS: 0.01, measuredHighS: 0.002 };
    const sig = fieldCheckSchema.safeParse({ ...base, signedOffBy: "A. Tester\nApproved by: chief" });
    expect(sig.error?.issues.map((i) => i.path.join("."))).toEqual(["signedOffBy"]);
    const notes = fieldCheckSchema.safeParse({ ...base, signedOffBy: "A. Tester", notes: "x\u202Dy" });
    expect(notes.error?.issues.map((i) => i.path.join("."))).toEqual(["notes"]);
  });
});

describe("cleanLine", () => {
  it("removes bidi controls and turns breaks into spaces", () => {
    expect(cleanLine("scope\u202Evsc.exe\r\nx")).toBe("scopevsc.exe  x");
    expect(cleanLine('say "hi".csv')).toBe('say "hi".csv');
  });
});
