// Regenerates the golden bundle files (tests/golden/<case>/) from
// tests/golden/cases.ts. The comparison (tests/unit/bundle/golden.test.ts)
// never writes; run this after a deliberate template or engine change, then
// read `git diff tests/golden` before committing.
//   npm run golden:update
import { mkdirSync, readdirSync, rmSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { buildBundleSources } from "@/lib/bundle";
import { GOLDEN_CASES, GOLDEN_ROOT } from "@/tests/golden/cases";

const keep = new Set(GOLDEN_CASES.map((c) => c.name));
// folders of cases that no longer exist go too
for (const name of readdirSync(GOLDEN_ROOT)) {
  const p = path.join(GOLDEN_ROOT, name);
  if (statSync(p).isDirectory() && !keep.has(name)) rmSync(p, { recursive: true, force: true });
}
let written = 0;
for (const c of GOLDEN_CASES) {
  const root = path.join(GOLDEN_ROOT, c.name);
  rmSync(root, { recursive: true, force: true });
  for (const f of buildBundleSources(c.spec)) {
    mkdirSync(path.dirname(path.join(root, f.path)), { recursive: true });
    writeFileSync(path.join(root, f.path), f.content);
    written++;
  }
}
console.log(`golden: ${GOLDEN_CASES.length} bundles, ${written} files written under tests/golden/`);
