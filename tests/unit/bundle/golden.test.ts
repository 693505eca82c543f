// Golden files: the generated bundle for a fixed spec is compared with
// tests/golden/bundle-basic/. A template change shows up as a unified diff
// (jsdiff createTwoFilesPatch) a reviewer can read; after checking it,
// regenerate with UPDATE_GOLDEN=1 npx vitest run tests/unit/bundle/golden.test.ts
import { createTwoFilesPatch } from "diff";
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { buildBundleSources, textOf } from "@/lib/bundle";
import { TARGETS, spec } from "./fixtures";

const ROOT = path.join(process.cwd(), "tests/golden/bundle-basic");
const GOLDEN_SPEC = spec([TARGETS[0], TARGETS[1], TARGETS[6], TARGETS[8], TARGETS[10], TARGETS[13]]);

function listFiles(dir: string, base = ""): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir).flatMap((name) => {
    const rel = base ? `${base}/${name}` : name;
    return statSync(path.join(dir, name)).isDirectory() ? listFiles(path.join(dir, name), rel) : [rel];
  });
}

describe("golden bundle", () => {
  const files = buildBundleSources(GOLDEN_SPEC);

  if (process.env.UPDATE_GOLDEN === "1") {
    rmSync(ROOT, { recursive: true, force: true });
    for (const f of files) {
      mkdirSync(path.dirname(path.join(ROOT, f.path)), { recursive: true });
      writeFileSync(path.join(ROOT, f.path), f.content);
    }
  }

  it("has the same file list as the golden folder", () => {
    expect(files.map((f) => f.path).sort()).toEqual(listFiles(ROOT).sort());
  });

  it.each(files.map((f) => [f.path, textOf(f)] as const))("%s matches its golden copy", (p, content) => {
    const golden = existsSync(path.join(ROOT, p)) ? readFileSync(path.join(ROOT, p), "utf8") : "";
    if (golden !== content) {
      const patch = createTwoFilesPatch(`golden/${p}`, `generated/${p}`, golden, content, "", "", {
        context: 3,
      });
      throw new Error(`${p} differs from its golden copy (UPDATE_GOLDEN=1 to accept):\n${patch}`);
    }
    expect(content).toBe(golden);
  });
});
