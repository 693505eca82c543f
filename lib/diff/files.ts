// Per-file line diffs between two revisions with the `diff` package. Only
// changed lines and a few lines of context are kept; every unchanged stretch
// in between (and before the first and after the last change) becomes one
// fold row that says how many lines it hides.
import { structuredPatch } from "diff";
import type { DiffLine, DiffRow, FileDiff, FileStatus } from "./types";

export const DEFAULT_CONTEXT = 3;

type Text = { path: string; content: string };

/** Lines of a file as the diff package counts them (a final newline ends the last line). */
export function lineCount(content: string): number {
  if (content === "") return 0;
  const n = content.split("\n").length;
  return content.endsWith("\n") ? n - 1 : n;
}

function hunkLines(h: { oldStart: number; newStart: number; lines: string[] }): DiffLine[] {
  const out: DiffLine[] = [];
  let oldLine = h.oldStart;
  let newLine = h.newStart;
  for (const raw of h.lines) {
    const mark = raw[0];
    const text = raw.slice(1);
    if (mark === "\\") continue; // "\ No newline at end of file"
    if (mark === "+") out.push({ kind: "added", text, newLine: newLine++ });
    else if (mark === "-") out.push({ kind: "removed", text, oldLine: oldLine++ });
    else out.push({ kind: "context", text, oldLine: oldLine++, newLine: newLine++ });
  }
  return out;
}

/** Rows for one file: hunks with context, unchanged regions folded. */
export function diffRows(before: string, after: string, context = DEFAULT_CONTEXT): DiffRow[] {
  const patch = structuredPatch("a", "b", before, after, undefined, undefined, { context });
  const rows: DiffRow[] = [];
  // Next line numbers not yet shown, on each side.
  let oldNext = 1;
  let newNext = 1;
  for (const h of patch.hunks) {
    // structuredPatch gives the 1-based line where the hunk starts, even for a
    // pure insertion (only the printed patch uses the "line before" form).
    const { oldStart, newStart } = h;
    const gap = oldStart - oldNext;
    if (gap > 0) rows.push({ kind: "fold", count: gap, oldFrom: oldNext, newFrom: newNext });
    rows.push(...hunkLines({ oldStart, newStart, lines: h.lines }));
    oldNext = oldStart + h.oldLines;
    newNext = newStart + h.newLines;
  }
  const tail = lineCount(before) - oldNext + 1;
  if (tail > 0) rows.push({ kind: "fold", count: tail, oldFrom: oldNext, newFrom: newNext });
  return rows;
}

function count(rows: DiffRow[], kind: "added" | "removed"): number {
  return rows.filter((r) => r.kind === kind).length;
}

/** Every path of either revision, sorted, with its status and rows. */
export function diffFiles(a: Text[], b: Text[], context = DEFAULT_CONTEXT): FileDiff[] {
  const before = new Map(a.map((f) => [f.path, f.content]));
  const after = new Map(b.map((f) => [f.path, f.content]));
  const paths = [...new Set([...before.keys(), ...after.keys()])].sort();
  return paths.map((path) => {
    const x = before.get(path);
    const y = after.get(path);
    const status: FileStatus =
      x === undefined ? "added" : y === undefined ? "removed" : x === y ? "unchanged" : "modified";
    const rows = diffRows(x ?? "", y ?? "", context);
    return { path, status, added: count(rows, "added"), removed: count(rows, "removed"), rows };
  });
}
