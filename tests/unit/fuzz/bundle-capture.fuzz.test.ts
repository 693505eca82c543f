// Property-based fuzzing (fast-check) of the bundle generator with arbitrary
// names and of the capture reader with arbitrary small texts. Names must stay
// inside C comments (nothing of them in the code once comments are removed)
// and every file must be produced; captures measure or fail with CaptureError.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { buildBundleSources, textOf } from "@/lib/bundle";
import { isCaptureError, measureCsv } from "@/lib/capture";
import { isEngineError } from "@/lib/engine";
import { nanPaths } from "./nan-paths";

const STAGE = { kind: "measured", periodS: 10e-3, highS: 2e-3 } as const;
const TARGET = { device: "atmega328p", clockHz: 16e6, periodS: 10e-3, highS: 2e-3, mode: "pwm" } as const;

const nasty = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.string({ unit: "binary", maxLength: 20 }),
  fc.constantFrom(
    "*/ int evil; /*",
    "\\\n#define evil 1",
    "??/\nevil",
    "</script><script>x</script>",
    "../../x",
    "`rm -rf /`",
    "\r\n*/evil",
  ),
);

/** C source with comments, string and char literals removed (a simple scanner). */
function codeOnly(src: string): string {
  return src.replace(/\/\*[\s\S]*?\*\/|\/\/[^\n]*|"(?:\\.|[^"\\\n])*"|'(?:\\.|[^'\\\n])*'/g, " ");
}

describe("buildBundleSources", () => {
  it("arbitrary names never leave a C comment and never break generation", () => {
    fc.assert(
      fc.property(nasty, nasty, nasty, (name, site, assetTag) => {
        let files;
        try {
          files = buildBundleSources({
            retrofit: { name, site, assetTag, mainsPowered: true, drivesThyristor: true },
            revision: 1,
            stage: STAGE as never,
            targets: [TARGET as never],
          });
        } catch (e) {
          if (isEngineError(e)) return;
          throw e;
        }
        expect(files.length).toBeGreaterThan(3);
        for (const f of files.filter((x) => /\.(c|h)$/.test(x.path))) {
          const code = codeOnly(textOf(f));
          expect(code, f.path).not.toMatch(/\bevil\b/);
          // Comments are balanced: no stray opener or closer outside them.
          expect(code, f.path).not.toMatch(/\/\*|\*\//);
        }
      }),
      { numRuns: 150, seed: 9101 },
    );
  });
});

describe("measureCsv", () => {
  const line = fc.oneof(
    fc.tuple(fc.double(), fc.double()).map(([a, b]) => `${a},${b}`),
    fc.tuple(fc.integer({ min: 0, max: 100 }), fc.constantFrom(0, 5)).map(([a, b]) => `${a * 1e-3},${b}`),
    fc.string({ maxLength: 20 }),
    fc.constantFrom("Time (s),CH1 (V)", "NaN,NaN", "1e999,-1e999", ";;", "\t", "0x10,1", "", "\u0000"),
  );
  const text = fc.oneof(
    fc.string({ maxLength: 200 }),
    fc
      .tuple(fc.array(line, { maxLength: 60 }), fc.constantFrom("\n", "\r\n", "\r"))
      .map(([ls, eol]) => ls.join(eol)),
  );
  it("arbitrary small texts measure without NaN or fail with a CaptureError", async () => {
    await fc.assert(
      fc.asyncProperty(text, async (t) => {
        try {
          const m = await measureCsv(t, { maxBytes: 1 << 16 });
          expect(nanPaths(m), JSON.stringify(t).slice(0, 200)).toEqual([]);
        } catch (e) {
          if (!isCaptureError(e)) throw e;
        }
      }),
      { numRuns: 600, seed: 9102 },
    );
  });
});
