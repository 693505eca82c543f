// The comparison as one unified patch (text/x-diff) that `patch -p1` or
// `git apply` can read: a/<path> is the older revision, b/<path> the newer.
import { createTwoFilesPatch } from "diff";
import type { RevisionRef } from "./types";

type Text = { path: string; content: string };

export function unifiedPatch(
  a: RevisionRef,
  b: RevisionRef,
  aFiles: Text[],
  bFiles: Text[],
  context = 3,
): string {
  const before = new Map(aFiles.map((f) => [f.path, f.content]));
  const after = new Map(bFiles.map((f) => [f.path, f.content]));
  const paths = [...new Set([...before.keys(), ...after.keys()])].sort();
  const parts: string[] = [];
  for (const path of paths) {
    const x = before.get(path);
    const y = after.get(path);
    if (x === y) continue;
    const oldName = x === undefined ? "/dev/null" : `a/${path}`;
    const newName = y === undefined ? "/dev/null" : `b/${path}`;
    const text = createTwoFilesPatch(oldName, newName, x ?? "", y ?? "", `r${a.number}`, `r${b.number}`, {
      context,
    });
    // Drop the "Index:" / "====" preamble; keep the ---/+++ headers and hunks.
    parts.push(text.slice(text.indexOf("---")));
  }
  return parts.join("");
}
