// A kept trimmer on the PIC12F1840: main.asm (the gpasm image) and main.c (the
// XC8 twin) load PR2, CCP1CON and CCPR1L from the calibration constant instead
// of numbers. PIC12F1840 datasheet DS40001441, CCP PWM mode: period =
// (PR2 + 1) x 4 x Tosc x prescale; the 10-bit duty is CCPR1L:DC1B with DC1B in
// CCP1CON<5:4> and CCP1M = 11xx for PWM. At the stored constant the
// expressions must give the fixed plan's values. Built inside the tests so a
// refusal fails a test rather than the file's loading.
import { describe, expect, it } from "vitest";
import { buildBundleSources } from "@/lib/bundle";
import { GOLDEN_CASES } from "../../golden/cases";

const trimmer = GOLDEN_CASES.find((c) => c.name === "kept-trimmer-555")!.spec;

function picFiles(): { asm: string; c: string; inc: string } {
  const files = buildBundleSources({
    ...trimmer,
    targets: trimmer.targets.filter((t) => t.device === "pic12f1840"),
  });
  const text = (p: string) => String(files.find((f) => f.path === `pic12f1840/src/${p}`)?.content);
  return { asm: text("main.asm"), c: text("main.c"), inc: text("trim_constant.inc") };
}

/** The operand of the movlw just before "movwf REG". */
function loaded(asm: string, reg: string): string | undefined {
  return new RegExp(`movlw\\s+(.+)\\n\\s+movwf\\s+${reg}\\n`).exec(asm)?.[1].trim();
}

const EXPR = {
  PR2: "(TRIM_PERIOD_COUNTS - 1)",
  CCP1CON: "(((TRIM_HIGH_COUNTS & 3) << 4) | 0x0C)",
  CCPR1L: "(TRIM_HIGH_COUNTS >> 2)",
} as const;

describe("PIC12F1840 kept trimmer: Timer2 and CCP1 from the constant", () => {
  it("main.asm and main.c load PR2, CCP1CON and CCPR1L from the constant", () => {
    const { asm, c } = picFiles();
    for (const [reg, expr] of Object.entries(EXPR)) {
      expect(loaded(asm, reg), `main.asm ${reg}`).toBe(expr);
      expect(c, `main.c ${reg}`).toContain(`  ${reg} = ${expr};`);
    }
  });

  it("at the stored constant the expressions give the plan's PR2 and 10-bit duty", () => {
    const { asm, c, inc } = picFiles();
    const period = Number(/^#define TRIM_PERIOD_COUNTS (\d+)$/m.exec(inc)?.[1]);
    const high = Number(
      new RegExp(`if TRIM_PERIOD_COUNTS == ${period}\\nTRIM_HIGH_COUNTS set (\\d+)`).exec(asm)?.[1],
    );
    expect([period, high].every(Number.isInteger), `${period}, ${high}`).toBe(true);
    // main.c states each fixed value in the comment before the write ("... -> 0xB5")
    const fixed = (reg: string) => Number(new RegExp(`-> (0x[0-9A-F]+) \\*/\\n  ${reg} = `).exec(c)?.[1]);
    expect(fixed("PR2")).toBe(period - 1);
    expect(fixed("CCP1CON")).toBe(((high & 3) << 4) | 0x0c);
    expect(fixed("CCPR1L")).toBe(high >> 2);
  });
});
