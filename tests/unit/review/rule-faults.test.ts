// Planted faults in the comment and release rules. Each rule is checked by one
// list of cases (the rules are the product's own, issue texts on review; no
// outside source), run against the real function and against copies with one
// fault planted: the real one must pass every case, each planted copy must
// fail at least one. Kept as negative cases so the checks cannot go slack.
import { describe, expect, it } from "vitest";
import { carryLine, carryMark, type Anchor } from "@/lib/review/anchors";
import { missedTargets, releaseOverride } from "@/lib/review/budget-miss";

type Case<F> = { what: string; holds: (f: F) => boolean };

function broken<F>(cases: Case<F>[], f: F): string[] {
  return cases.filter((c) => !c.holds(f)).map((c) => c.what);
}

const ANCHORS: Anchor[] = [
  { kind: "quantity", key: "target1.periodS", label: "Target 1 period", text: "1.000 ms" },
  { kind: "register", key: "target1.register.OCR1A", label: "Target 1 OCR1A", text: "249" },
];

const markCases: Case<typeof carryMark>[] = [
  { what: "same text is same", holds: (f) => f(ANCHORS, "target1.periodS", "1.000 ms") === "same" },
  { what: "other text is changed", holds: (f) => f(ANCHORS, "target1.register.OCR1A", "250") === "changed" },
  { what: "missing key is gone", holds: (f) => f(ANCHORS, "target2.periodS", "1.000 ms") === "gone" },
  { what: "no stored text is same", holds: (f) => f(ANCHORS, "target1.periodS", null) === "same" },
];

const lineCases: Case<typeof carryLine>[] = [
  {
    what: "a line below two inserted lines moves down two",
    holds: (f) => {
      const r = f("a\nb\nc\n", "x\ny\na\nb\nc\n", 3);
      return r.mark === "same" && r.line === 5;
    },
  },
  {
    what: "a rewritten line is changed, at its new text",
    holds: (f) => {
      const r = f("a\nb\nc\n", "a\nB\nc\n", 2);
      return r.mark === "changed" && r.line === 2;
    },
  },
  { what: "a file that went is gone", holds: (f) => f("a\n", undefined, 1).mark === "gone" },
];

const miss = (verdict: string) => ({ plan: { device: "atmega328p" }, budget: { verdict, notes: ["clock"] } });
const PLANS_MISS = [miss("meets"), miss("misses")];
type Rule = typeof releaseOverride;
const releaseCases: Case<Rule>[] = [
  { what: "no miss needs no reason", holds: (f) => "override" in f([miss("meets")], "", 1) },
  { what: "a miss without reason is refused", holds: (f) => "refusal" in f(PLANS_MISS, "", 2) },
  { what: "a blank reason is no reason", holds: (f) => "refusal" in f(PLANS_MISS, "   \n", 2) },
  {
    what: "a reason releases, trimmed, naming the second target",
    holds: (f) => {
      const r = f(PLANS_MISS, "  Site accepts drift. ", 2);
      return (
        "override" in r &&
        r.override?.reason === "Site accepts drift." &&
        r.override.targets[0]?.position === 2
      );
    },
  },
];

describe("comment carry-over and release rules, with planted faults", () => {
  it("carryMark passes; planted faults are caught", () => {
    expect(broken(markCases, carryMark)).toEqual([]);
    // planted: the text is not compared, so a changed value reads "same"
    const ignoresText: typeof carryMark = (a, k) => (a.some((x) => x.key === k) ? "same" : "gone");
    // planted: a vanished anchor falls back to "changed" instead of "gone"
    const neverGone: typeof carryMark = (a, k, t) =>
      a.find((x) => x.key === k)?.text === t ? "same" : "changed";
    // planted: compares the label, not the value text
    const byLabel: typeof carryMark = (a, k, t) => {
      const now = a.find((x) => x.key === k);
      return !now ? "gone" : t === null || now.label === t ? "same" : "changed";
    };
    for (const f of [ignoresText, neverGone, byLabel]) expect(broken(markCases, f)).not.toEqual([]);
  });

  it("carryLine passes; planted faults are caught", () => {
    expect(broken(lineCases, carryLine)).toEqual([]);
    // planted: the line number is kept as it was, not moved through the changes
    const stays: typeof carryLine = (b, a, l) => ({
      ...carryLine(b, a, l),
      line: a === undefined ? null : l,
    });
    // planted: every line of a changed file reads as the same
    const allSame: typeof carryLine = (b, a, l) =>
      a === undefined ? { mark: "gone", line: null } : { mark: "same", line: l };
    for (const f of [stays, allSame]) expect(broken(lineCases, f)).not.toEqual([]);
  });

  it("the release rule passes; planted faults are caught", () => {
    expect(broken(releaseCases, releaseOverride)).toEqual([]);
    expect(missedTargets(PLANS_MISS).map((m) => m.position)).toEqual([2]);
    // planted: the reason is not trimmed, so blanks pass as a reason
    const untrimmed: Rule = (p, r, n) =>
      r.length ? { override: { reason: r, text: "", targets: missedTargets(p) } } : releaseOverride(p, r, n);
    // planted: only the first target's verdict is read
    const firstOnly: Rule = (p, r, n) => releaseOverride(Array.isArray(p) ? p.slice(0, 1) : p, r, n);
    // planted: a miss is released without any reason
    const noGate: Rule = () => ({ override: null });
    for (const f of [untrimmed, firstOnly, noGate]) expect(broken(releaseCases, f)).not.toEqual([]);
  });
});
