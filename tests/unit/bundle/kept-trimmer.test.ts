// A stage with a trimmer: the bundle's timing.h holds the calibration constant
// with its range, main.c writes TOP and compare from it, the checklist has the
// steps that set it, and a target whose timer cannot hold the trimmer's range
// is refused naming the target. Count lengths: ATmega328P Timer1 at divider 1
// = 1/16 MHz (DS40002061); ATtiny85 Timer0 fast PWM mode 7 with TOP = OCR0A is
// 8 bits (ATtiny25/45/85 datasheet, Timer/Counter0).
import { describe, expect, it } from "vitest";
import { buildBundleSources } from "@/lib/bundle";
import { isEngineError } from "@/lib/engine";
import { GOLDEN_CASES } from "../../golden/cases";

const spec = GOLDEN_CASES.find((c) => c.name === "kept-trimmer-555")!.spec;
const files = buildBundleSources(spec);
const text = (p: string) => {
  const f = files.find((x) => x.path === p);
  if (!f) throw new Error(`no ${p}`);
  return String(f.content);
};

describe("kept trimmer in the bundle", () => {
  it("timing.h holds the constant, its range and the build's range check", () => {
    const h = text("atmega328p/src/timing.h");
    const stored = /#define TIMING_PERIOD_COUNTS (\d+)u/.exec(h)![1];
    expect(h).toContain(`#define TRIM_PERIOD_COUNTS ${stored}u`);
    expect(h).toMatch(
      /#if TRIM_PERIOD_COUNTS < TRIM_COUNTS_MIN \|\| TRIM_PERIOD_COUNTS > TRIM_COUNTS_MAX\n#error/,
    );
    expect(h).toContain("62.50000 ns"); // one count at 16 MHz, divider 1
    for (const dev of ["atmega328p", "attiny85", "rp2040", "stm32g031", "msp430g2553"]) {
      expect(text(`${dev}/src/main.c`), dev).toContain("(TRIM_PERIOD_COUNTS - 1u)");
      expect(text(`${dev}/src/main.c`), dev).toMatch(/TRIM_HIGH_COUNTS/);
    }
  });

  it("the checklist sets the constant: measure, compute and write, measure again", () => {
    const c = text("atmega328p/CHECKLIST.md");
    expect(c).toMatch(/\| T1 \| Before the old board comes out, measure its period/);
    expect(c).toMatch(
      /\| T2 \| Compute TRIM_PERIOD_COUNTS = measured period \/ 62\.50000 ns.*rebuild and flash/,
    );
    expect(c).toMatch(/\| T3 \| Measure the new board's period/);
    expect(c).not.toMatch(/\| P1 \|/);
    // the PIC12F1840: one #define line in src/trim_constant.inc, included by main.asm (gpasm) and timing.h (XC8)
    expect(text("pic12f1840/CHECKLIST.md")).toMatch(/write it in src\/trim_constant\.inc/);
    expect(text("pic12f1840/src/trim_constant.inc")).toBe("#define TRIM_PERIOD_COUNTS 182\n");
    expect(text("pic12f1840/src/main.asm")).toContain('#include "trim_constant.inc"');
    expect(text("pic12f1840/src/main.asm")).toContain("movlw   (TRIM_PERIOD_COUNTS - 1)");
    expect(text("pic12f1840/src/timing.h")).toContain('#include "trim_constant.inc"');
    expect(text("pic12f1840/src/main.c")).toContain("PR2 = (TRIM_PERIOD_COUNTS - 1);");
  });

  it("plan.json names the constant, its file and range per target", () => {
    const plan = JSON.parse(text("plan.json")) as { targets: { control: Record<string, unknown> }[] };
    expect(plan.targets[0].control).toMatchObject({
      kind: "trimmer",
      constant: "TRIM_PERIOD_COUNTS",
      file: "src/timing.h",
      countS: 1 / 16e6,
    });
  });

  it("a trimmer range the 8-bit Timer0 cannot hold is refused, naming the target", () => {
    let caught: unknown;
    try {
      buildBundleSources({
        ...spec,
        control: { kind: "trimmer", field: "rb", seriesR: 8.2e3, trackR: 20e3 },
      });
    } catch (e) {
      caught = e;
    }
    expect(isEngineError(caught)).toBe(true);
    expect((caught as { field?: string }).field).toBe("targets.1");
    expect((caught as Error).message).toMatch(/attiny85.*trimmer's longest period/);
  });
});
