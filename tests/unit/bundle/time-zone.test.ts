// The zip does not depend on the time zone: fixed entry dates (product.md,
// deterministic bundle). The other zones run in child processes, so this
// test process keeps its own TZ. Kept out of the mutation runs
// (vitest.mutation.config.mts): the children start a TypeScript loader each.
import { execFileSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import JSZip from "jszip";
import { describe, expect, it } from "vitest";
import { buildBundleSources, sha256Hex, zipBundle } from "@/lib/bundle";
import { TARGETS, spec } from "./fixtures";

describe("bundle zip and the time zone", () => {
  it("the zip is the same in another time zone (fixed entry dates, no folder entries)", async () => {
    const here = sha256Hex(await zipBundle(buildBundleSources(spec(TARGETS.slice(0, 1)))));
    // the other time zone lives in a child process (Node reads TZ from its environment)
    const child = fileURLToPath(new URL("./zip-sha-child.ts", import.meta.url));
    for (const tz of ["Pacific/Kiritimati", "America/St_Johns"]) {
      const out = execFileSync(process.execPath, ["--import", "tsx", child], {
        env: { ...process.env, TZ: tz },
        encoding: "utf8",
      }).trim();
      const [offset, sha] = out.split(" ");
      expect([tz, Number(offset)]).not.toEqual([tz, 0]);
      expect([tz, sha]).toEqual([tz, here]);
    }
    const zip = await JSZip.loadAsync(await zipBundle(buildBundleSources(spec(TARGETS.slice(0, 1)))));
    expect(Object.values(zip.files).some((f) => f.dir)).toBe(false);
  });
});
