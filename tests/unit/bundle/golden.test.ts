// Golden files: every bundle of tests/golden/cases.ts (each device with every
// timer and mode the solver emits, plus checklist variants) is compared with
// tests/golden/<case>/. This test never writes: after a deliberate change run
// `npm run golden:update` (scripts/golden-update.ts) and read the diff. A
// text change shows as a unified diff (jsdiff createTwoFilesPatch); binary
// images compare byte for byte.
import { createTwoFilesPatch } from "diff";
import { existsSync, readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleFile } from "@/lib/bundle";
import { listDevices, planTarget } from "@/lib/engine";
import { GOLDEN_CASES, GOLDEN_ROOT } from "@/tests/golden/cases";

function listFiles(dir: string, base = ""): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir).flatMap((name) => {
    const rel = base ? `${base}/${name}` : name;
    return statSync(path.join(dir, name)).isDirectory() ? listFiles(path.join(dir, name), rel) : [rel];
  });
}

const UPDATE = "run `npm run golden:update` to accept, after reading the change";

describe("golden bundle set", () => {
  it("covers every device, timer and mode the solver offers, each planned as asked", () => {
    const wanted = listDevices().flatMap((d) =>
      d.timers.flatMap((t) => t.modes.map((m) => `${d.id} ${t.name} ${m}`)),
    );
    const planned = new Set<string>();
    for (const c of GOLDEN_CASES)
      for (const req of c.spec.targets) {
        const plan = planTarget(req);
        // a fallback (pwm request planned as isr) would leave a mode untested
        expect([req.device, req.timer ?? plan.timer, req.mode]).toEqual([plan.device, plan.timer, plan.mode]);
        planned.add(`${plan.device} ${plan.timer} ${plan.mode}`);
      }
    expect(wanted.filter((w) => !planned.has(w))).toEqual([]);
  });

  it("has no golden folder without a case", () => {
    const folders = readdirSync(GOLDEN_ROOT).filter((n) => statSync(path.join(GOLDEN_ROOT, n)).isDirectory());
    expect(folders.sort()).toEqual(GOLDEN_CASES.map((c) => c.name).sort());
  });

  for (const c of GOLDEN_CASES)
    describe(c.name, async () => {
      const root = path.join(GOLDEN_ROOT, c.name);
      // A refusal while building fails a test here rather than the file's loading: a file that
      // cannot load reports no tests, which the mutation runner does not count as a failure.
      let files: BundleFile[] = [];
      let refusal: unknown;
      try {
        files = await buildBundleSources(c.spec);
      } catch (e) {
        refusal = e;
      }

      it("builds", () => {
        expect(refusal, String(refusal)).toBeUndefined();
      });

      it("has the same file list as its golden folder", () => {
        expect(files.map((f) => f.path).sort(), UPDATE).toEqual(listFiles(root).sort());
      });

      it.each(files.map((f) => [f.path, f] as const))("%s matches its golden copy", (p, f) => {
        const file = path.join(root, p);
        const golden = existsSync(file) ? readFileSync(file) : Buffer.alloc(0);
        if (typeof f.content !== "string") {
          expect(Buffer.from(f.content).equals(golden), `${p}: image bytes differ; ${UPDATE}`).toBe(true);
          return;
        }
        const text = golden.toString("utf8");
        if (text !== f.content) {
          const patch = createTwoFilesPatch(`golden/${p}`, `generated/${p}`, text, f.content, "", "", {
            context: 3,
          });
          throw new Error(`${c.name}/${p} differs from its golden copy (${UPDATE}):\n${patch}`);
        }
        expect(f.content).toBe(text);
      });
    });
});
