// Per-file diffs and folding, checked against GNU diffutils (`diff -u`, Debian
// package diffutils) and GNU patch: the rows must account for every line of
// both files, and the unified patch must turn the old file into the new one.
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { diffFiles, diffRows, lineCount, unifiedPatch } from "@/lib/diff";

function requireTool(name: string) {
  const r = spawnSync(name, ["--version"]);
  if (r.status !== 0) throw new Error(`${name} is missing: apt-get install -y diffutils patch`);
}

const lines = (n: number, f = (i: number) => `line ${i}`) =>
  Array.from({ length: n }, (_, i) => f(i + 1)).join("\n") + "\n";

describe("diffRows folding", () => {
  it("folds the unchanged regions around one changed line in a 40-line file", () => {
    const before = lines(40);
    const after = before.replace("line 20\n", "line 20 changed\n");
    const rows = diffRows(before, after, 3);
    // One change at line 20 with 3 lines of context: lines 1..16 and 24..40 folded.
    expect(rows[0]).toEqual({ kind: "fold", count: 16, oldFrom: 1, newFrom: 1 });
    expect(rows.at(-1)).toEqual({ kind: "fold", count: 17, oldFrom: 24, newFrom: 24 });
    expect(rows.filter((r) => r.kind === "context")).toHaveLength(6);
    expect(rows.find((r) => r.kind === "removed")).toEqual({ kind: "removed", text: "line 20", oldLine: 20 });
    expect(rows.find((r) => r.kind === "added")).toEqual({
      kind: "added",
      text: "line 20 changed",
      newLine: 20,
    });
  });

  it("shows a fold between two changes far apart and none when the context meets", () => {
    const before = lines(30);
    const far = before.replace("line 5\n", "five\n").replace("line 25\n", "twenty-five\n");
    const farRows = diffRows(before, far, 2);
    expect(farRows.filter((r) => r.kind === "fold").map((r) => r.count)).toEqual([2, 15, 3]); // shown: 3..7 and 23..27
    const near = before.replace("line 5\n", "five\n").replace("line 9\n", "nine\n");
    const nearRows = diffRows(before, near, 2);
    // Lines 6..8 are within 2 lines of both changes: one hunk, no fold between.
    expect(nearRows.filter((r) => r.kind === "fold").map((r) => r.count)).toEqual([2, 19]); // shown: 3..11
  });

  it("keeps a whole unchanged file as a single fold", () => {
    expect(diffRows(lines(12), lines(12))).toEqual([{ kind: "fold", count: 12, oldFrom: 1, newFrom: 1 }]);
  });

  it("accounts for every line of both sides (shown plus folded)", () => {
    const before = lines(200, (i) => `x${i % 17}`);
    const after = lines(210, (i) => (i % 37 === 0 ? `changed ${i}` : `x${i % 17}`));
    const rows = diffRows(before, after, 3);
    let oldSeen = 0;
    let newSeen = 0;
    for (const r of rows) {
      if (r.kind === "fold") {
        oldSeen += r.count;
        newSeen += r.count;
      } else if (r.kind === "context") {
        oldSeen += 1;
        newSeen += 1;
      } else if (r.kind === "removed") oldSeen += 1;
      else newSeen += 1;
    }
    expect(oldSeen).toBe(lineCount(before));
    expect(newSeen).toBe(lineCount(after));
  });
});

describe("diffFiles", () => {
  it("labels added, removed, modified and unchanged files and counts lines", () => {
    const a = [
      { path: "b/keep.h", content: "same\n" },
      { path: "a/main.c", content: "int x = 1;\nint y = 2;\n" },
      { path: "old.md", content: "gone\n" },
    ];
    const b = [
      { path: "b/keep.h", content: "same\n" },
      { path: "a/main.c", content: "int x = 1;\nint y = 3;\n" },
      { path: "new.md", content: "one\ntwo\n" },
    ];
    const d = diffFiles(a, b);
    expect(d.map((f) => [f.path, f.status, f.added, f.removed])).toEqual([
      ["a/main.c", "modified", 1, 1],
      ["b/keep.h", "unchanged", 0, 0],
      ["new.md", "added", 2, 0],
      ["old.md", "removed", 0, 1],
    ]);
  });
});

describe("unifiedPatch against GNU diff and patch", () => {
  const before = lines(60, (i) => `#define T${i} ${i * 3}`);
  const after = before.replace("#define T30 90\n", "#define T30 91\n").replace("#define T58 174\n", "");
  const ref = { id: 1, number: 1, state: "released" };
  const refB = { id: 2, number: 2, state: "awaiting_check" };

  it("has the same hunks as diff -u", () => {
    requireTool("diff");
    const dir = mkdtempSync(path.join(tmpdir(), "cg-diff-"));
    writeFileSync(path.join(dir, "old"), before);
    writeFileSync(path.join(dir, "new"), after);
    const gnu = spawnSync("diff", ["-u", "old", "new"], { cwd: dir, encoding: "utf8" }).stdout;
    const ours = unifiedPatch(
      ref,
      refB,
      [{ path: "t.h", content: before }],
      [{ path: "t.h", content: after }],
    );
    const hunks = (s: string) => s.split("\n").filter((l) => !l.startsWith("---") && !l.startsWith("+++"));
    expect(hunks(ours)).toEqual(hunks(gnu));
  });

  it("applies with patch -p1 and yields the newer files", () => {
    requireTool("patch");
    const dir = mkdtempSync(path.join(tmpdir(), "cg-patch-"));
    writeFileSync(path.join(dir, "t.h"), before);
    writeFileSync(path.join(dir, "gone.md"), "old\n");
    const text = unifiedPatch(
      ref,
      refB,
      [
        { path: "t.h", content: before },
        { path: "gone.md", content: "old\n" },
      ],
      [
        { path: "t.h", content: after },
        { path: "added.md", content: "fresh\n" },
      ],
    );
    execFileSync("patch", ["-p1", "--batch", "--quiet"], { cwd: dir, input: text });
    expect(readFileSync(path.join(dir, "t.h"), "utf8")).toBe(after);
    expect(readFileSync(path.join(dir, "added.md"), "utf8")).toBe("fresh\n");
    expect(spawnSync("test", ["-e", path.join(dir, "gone.md")]).status).toBe(1);
  });

  it("leaves unchanged files out of the patch", () => {
    const text = unifiedPatch(
      ref,
      refB,
      [{ path: "same.c", content: "x\n" }],
      [{ path: "same.c", content: "x\n" }],
    );
    expect(text).toBe("");
  });
});
