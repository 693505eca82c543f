// What a comment can be anchored to besides a line: a target's quantity
// (period, high time, delay from the input edge, worst-case budget) or a
// register the target's firmware writes. Each anchor has a stable key and
// the text of its value in that revision; a comment stores the text it saw,
// so in a later revision it is marked "changed" when the text differs and
// "gone" when the key no longer exists. Pure: reads the stored plans only.
import { formatEng } from "@/lib/engine";
import { registerChanges } from "@/lib/diff/registers";
import { diffRows, lineCount } from "@/lib/diff/files";
import type { RevisionSnapshot } from "@/lib/diff/types";

export type AnchorKind = "revision" | "file" | "line" | "quantity" | "register";

export type Anchor = {
  kind: "quantity" | "register";
  /** "target1.periodS", "target2.register.ICR1" */
  key: string;
  /** plain label: "Target 1 period", "Target 2 ICR1" */
  label: string;
  /** the value as shown, e.g. "1.000 ms", "249 (0xF9)" */
  text: string;
};

const obj = (v: unknown): Record<string, unknown> =>
  v !== null && typeof v === "object" && !Array.isArray(v) ? (v as Record<string, unknown>) : {};
const num = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);

const QUANTITIES = [
  ["periodS", "period"],
  ["highS", "high time"],
  ["delayS", "delay from the input edge"],
] as const;

/** Every quantity and register anchor of a revision, in page order. */
export function revisionAnchors(
  rev: Pick<RevisionSnapshot, "plans"> & Partial<Pick<RevisionSnapshot, "spec">>,
) {
  const out: Anchor[] = [];
  const plans = Array.isArray(rev.plans) ? rev.plans : [];
  plans.forEach((entry, i) => {
    const e = obj(entry);
    const plan = "plan" in e ? obj(e.plan) : e;
    const n = i + 1;
    for (const [field, what] of QUANTITIES) {
      const v = num(plan[field]);
      if (v !== null)
        out.push({
          kind: "quantity",
          key: `target${n}.${field}`,
          label: `Target ${n} ${what}`,
          text: formatEng(v, "s", 6),
        });
    }
    const budget = obj(e.budget);
    const total = num(budget.totalPpm);
    if (total !== null)
      out.push({
        kind: "quantity",
        key: `target${n}.budgetPpm`,
        label: `Target ${n} accuracy budget`,
        text: `${Number(total.toPrecision(4))} ppm, ${String(budget.verdict ?? "")}`,
      });
  });
  for (const t of registerChanges(rev, rev)) {
    for (const r of t.rows) {
      if (r.after === null) continue;
      out.push({
        kind: "register",
        key: `target${t.position}.register.${r.reg}`,
        label: `Target ${t.position} ${r.reg}`,
        text: `${r.after}`,
      });
    }
  }
  return out;
}

/**
 * The anchor a row of the "numbers that changed" table (lib/diff/numbers.ts)
 * can carry a comment on: its target quantities and registers keep their key
 * ("target1.periodS"), its registers read "targetN.registers.X" where anchors
 * say "targetN.register.X". Null when the row is not an anchor of `anchors`
 * (stage values, pins, errors).
 */
export function anchorKeyOfNumber(numberKey: string, anchorKeys: readonly string[]): string | null {
  const key = numberKey.replace(/^(target\d+)\.registers\./, "$1.register.");
  return anchorKeys.includes(key) ? key : null;
}

export type CarryMark = "same" | "changed" | "gone";

/** How a comment written with `text` on anchor `key` reads in a revision with these anchors. */
export function carryMark(anchors: Anchor[], key: string, text: string | null): CarryMark {
  const now = anchors.find((a) => a.key === key);
  if (!now) return "gone";
  return text === null || now.text === text ? "same" : "changed";
}

/** Where line `line` of a file's older text sits in its newer text: the same
 *  line moved by the changes above it ("same"), the line written in its place
 *  ("changed"), or nothing when the file is gone. */
export function carryLine(
  before: string | undefined,
  after: string | undefined,
  line: number,
): { mark: CarryMark; line: number | null } {
  if (after === undefined) return { mark: "gone", line: null };
  if (before === undefined) return { mark: "changed", line: Math.min(line, Math.max(1, lineCount(after))) };
  if (before === after) return { mark: "same", line };
  const rows = diffRows(before, after, Number.MAX_SAFE_INTEGER);
  let removedAt = -1;
  for (let i = 0; i < rows.length; i++) {
    const r = rows[i];
    if (r.kind === "fold" && line >= r.oldFrom && line < r.oldFrom + r.count)
      return { mark: "same", line: r.newFrom + line - r.oldFrom };
    if (r.kind === "context" && r.oldLine === line) return { mark: "same", line: r.newLine };
    if (r.kind === "removed" && r.oldLine === line) {
      removedAt = i;
      break;
    }
  }
  if (removedAt < 0) return { mark: "gone", line: null };
  // A change block is a run of removed lines then a run of added ones: the
  // k-th removed line was rewritten as the k-th added line (or, past the end
  // of the added run, the last of them; with none, the next line kept).
  let start = removedAt;
  while (start > 0 && rows[start - 1].kind === "removed") start--;
  let end = removedAt;
  while (end + 1 < rows.length && rows[end + 1].kind === "removed") end++;
  const added: number[] = [];
  for (let i = end + 1; i < rows.length; i++) {
    const r = rows[i];
    if (r.kind !== "added") break;
    added.push(r.newLine);
  }
  const k = removedAt - start;
  if (added.length) return { mark: "changed", line: added[Math.min(k, added.length - 1)] };
  for (let i = end + 1; i < rows.length; i++) {
    const r = rows[i];
    if (r.kind === "context") return { mark: "changed", line: r.newLine };
    if (r.kind === "fold") return { mark: "changed", line: r.newFrom };
  }
  const n = lineCount(after);
  return n > 0 ? { mark: "changed", line: n } : { mark: "gone", line: null };
}
