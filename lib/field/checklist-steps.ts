// The lines of a target's CHECKLIST.md as steps a technician ticks or measures
// on the phone: every "- [ ]" box (safety steps and the like) and every row of
// a check table (| # | Check | Expected | Pass limits | Measured | Pass |).
// Read from the bundle's own file, so the phone and the paper list the same
// lines. Pure (no server imports): the field page and the server share it.
import { parseEng, type EngUnit } from "@/lib/engine";

export type ChecklistStep = {
  /** The table's own number (B2, S5, T1, P1) or C1, C2... for boxes in lists. */
  id: string;
  section: string;
  text: string;
  /** "tick": a box; "measure": a table row with a Measured column; "info": derived, not judged. */
  kind: "tick" | "measure" | "info";
  expected?: string;
  limits?: string;
  /** Numeric pass limits read from the "Pass limits" cell ("a … b unit"), when it has them. */
  range?: { min: number; max: number; unit: EngUnit };
  /** Lines the measured period / high time fields above judge (bench B-lines). */
  from?: "period" | "high";
  /** A safety step: confirmed before the check can be recorded. */
  safety: boolean;
};

const CHECK_HEADER =
  /^\|\s*#\s*\|\s*Check\s*\|\s*Expected\s*\|\s*Pass limits\s*\|\s*Measured\s*\|\s*Pass\s*\|/;
const SAFETY = /safe/i;

/** Markdown cell text to plain text: escapes, code ticks and <br> removed. */
export function plainCell(s: string): string {
  return s
    .replace(/<br>/g, "; ")
    .replace(/`([^`]*)`/g, "$1")
    .replace(/\\([\\`*_{}[\]()#+\-.!|])/g, "$1")
    .replace(/\*\*([^*]+)\*\*/g, "$1")
    .trim();
}

function cells(line: string): string[] {
  const body = line.trim().replace(/^\|/, "").replace(/\|$/, "");
  return body.split(/(?<!\\)\|/).map((c) => c.trim());
}

const UNIT_AT_END = /(Hz|%|V|A|s)$/;

/** "9.897938 ms … 10.10206 ms<br>limit from: …" -> numbers, or undefined. */
export function rangeOf(limits: string): ChecklistStep["range"] {
  const first = limits.split("<br>")[0];
  const parts = first.split("…").map((p) => p.trim());
  if (parts.length !== 2) return undefined;
  const unit = UNIT_AT_END.exec(parts[1])?.[1] as EngUnit | undefined;
  if (!unit || UNIT_AT_END.exec(parts[0])?.[1] !== unit) return undefined;
  try {
    const min = parseEng(parts[0], unit);
    const max = parseEng(parts[1], unit);
    return min <= max ? { min, max, unit } : undefined;
  } catch {
    return undefined;
  }
}

export function checklistSteps(markdown: string): ChecklistStep[] {
  const steps: ChecklistStep[] = [];
  let section = "";
  let inCheckTable = false;
  let boxes = 0;
  for (const line of markdown.split("\n")) {
    const h = /^#{2,4}\s+(.*)$/.exec(line);
    if (h) {
      section = plainCell(h[1]);
      inCheckTable = false;
      continue;
    }
    const box = /^- \[ \]\s+(.*)$/.exec(line);
    if (box) {
      boxes += 1;
      steps.push({
        id: `C${boxes}`,
        section,
        text: plainCell(box[1]),
        kind: "tick",
        safety: SAFETY.test(section),
      });
      continue;
    }
    if (CHECK_HEADER.test(line)) {
      inCheckTable = true;
      continue;
    }
    if (!line.startsWith("|")) {
      inCheckTable = false;
      continue;
    }
    if (!inCheckTable || /^\|\s*-/.test(line)) continue;
    const [id, check, expected, limits, , pass] = cells(line);
    if (!id || !check) continue;
    const text = plainCell(check);
    const bench = /^B\d+$/.test(id);
    const from =
      bench && /^Period at/.test(text) ? "period" : bench && /^High time at/.test(text) ? "high" : undefined;
    const range = rangeOf(limits ?? "");
    steps.push({
      id,
      section,
      text,
      kind: /information/i.test(pass ?? "") ? "info" : "measure",
      expected: plainCell(expected ?? ""),
      limits: plainCell(limits ?? ""),
      ...(range ? { range } : {}),
      ...(from ? { from } : {}),
      safety: false,
    });
  }
  return steps;
}
