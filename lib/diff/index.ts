// Revision comparison: changed numbers, per-file diffs, unified patch.
import { diffFiles } from "./files";
import { changedNumbers } from "./numbers";
import type { RevisionComparison, RevisionRef, RevisionSnapshot } from "./types";

export { changedNumbers, flattenRevision, formatValue } from "./numbers";
export { diffFiles, diffRows, lineCount, DEFAULT_CONTEXT } from "./files";
export { unifiedPatch } from "./patch";
export type * from "./types";

export function compareSnapshots(
  retrofitId: number,
  a: RevisionRef & RevisionSnapshot,
  b: RevisionRef & RevisionSnapshot,
): RevisionComparison {
  return {
    retrofitId,
    a: { id: a.id, number: a.number, state: a.state },
    b: { id: b.id, number: b.number, state: b.state },
    numbers: changedNumbers(a, b),
    files: diffFiles(a.files, b.files),
  };
}
