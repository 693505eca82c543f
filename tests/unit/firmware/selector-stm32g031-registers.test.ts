// A kept selector switch on the STM32G031 (golden case kept-selector-555),
// proven by registers: the emulator harness (lib/firmware/emulate/harness/
// stm32g031-emu.py) has no SysTick counter and no input pins, so the debounce
// loop cannot run there. The generated part is read back and judged against
// RM0444: GPIOx_MODER 00 = input and GPIOx_PUPDR 01 = pull-up on each contact
// pin of the pin map, IDR bit = the pin, and ARR/CCRx per position from the
// timer law period = (PSC+1)(ARR+1)/f_TIM, high = CCRx(PSC+1)/f_TIM (PWM mode 1)
// against the old stage, NE555 astable T = ln2*(Ra + 2*Rb)*C, high =
// ln2*(Ra + Rb)*C (TI SLFS022), within one count. The same debounce and
// position rule run in rp2040js and mspdebug (selector-rp2040-emulator,
// selector-msp430g2553-sim). The folder's image builds (arm-none-eabi-gcc).
// Planted faults kept as negative cases: position 1 on the wrong pin, pull-down.
import { describe, expect, it } from "vitest";
import { buildBundleSources } from "@/lib/bundle";
import { buildTargetImages } from "@/lib/firmware/build-images";
import { GOLDEN_CASES } from "../../golden/cases";

const spec = GOLDEN_CASES.find((c) => c.name === "kept-selector-555")!.spec;
const files = buildBundleSources(spec);
const text = (p: string) => String(files.find((f) => f.path === p)!.content);
const header = text("stm32g031/src/selector_control.h");
const pinmap = text("stm32g031/PINMAP.md");
const values = (spec.control as { values: readonly number[] }).values;
const CLOCK = 16e6;

function problems(src: string): string[] {
  const out: string[] = [];
  const list = (name: string) =>
    [...new RegExp(`${name}\\[SEL_POSITIONS\\] = \\{([^}]*)\\}`).exec(src)![1].matchAll(/(\d+)u/g)].map((m) =>
      Number(m[1]),
    );
  const bits = list("sel_bit");
  const arr = list("sel_arr");
  const ccr = list("sel_ccr");
  const psc = Number(/->PSC = (\d+)u;/.exec(src)![1]);
  const moder = Number(/GPIOA->MODER &= ~(0x[0-9A-F]+)u;/.exec(src)![1]);
  const pupdr = /GPIOA->PUPDR = \(GPIOA->PUPDR & ~(0x[0-9A-F]+)u\) \| (0x[0-9A-F]+)u;/.exec(src)!;
  const mask = Number(/#define SEL_MASK (0x[0-9A-F]+)u/.exec(src)![1]);
  bits.forEach((b, i) => {
    // the pin map's contact pin of this position
    const pin = new RegExp(`switch position ${i + 1} [^|]*\\| PA(\\d+) `).exec(pinmap);
    if (!pin || Number(pin[1]) !== b) out.push(`position ${i + 1} read on PA${b}, pin map ${pin?.[1]}`);
    if (!(mask & (1 << b))) out.push(`PA${b} not in the IDR mask`);
    if (((moder >> (2 * b)) & 3) !== 3) out.push(`PA${b} MODER not cleared to 00 (input)`);
    if (((Number(pupdr[1]) >> (2 * b)) & 3) !== 3 || ((Number(pupdr[2]) >> (2 * b)) & 3) !== 1)
      out.push(`PA${b} PUPDR not 01 (pull-up)`);
    const count = (psc + 1) / CLOCK;
    const T = Math.LN2 * (1e3 + 2 * 10e3) * values[i];
    const H = Math.LN2 * (1e3 + 10e3) * values[i];
    if (Math.abs((arr[i] + 1) * count - T) > count)
      out.push(`position ${i + 1}: period ${(arr[i] + 1) * count} s, want ${T} s`);
    if (Math.abs(ccr[i] * count - H) > count)
      out.push(`position ${i + 1}: high ${ccr[i] * count} s, want ${H} s`);
  });
  return out;
}

describe("STM32G031 keeps the selector switch (by registers)", () => {
  it("inputs with pull-ups on PA5..PA7 and ARR/CCR1 per position follow the old stage", () => {
    expect(problems(header)).toEqual([]);
    expect(text("stm32g031/src/main.c")).toMatch(
      /selector_control_init\(\);\s*for \(;;\) \{\s*selector_control_poll\(\);/,
    );
  });

  it("the folder's image builds with the part", async () => {
    const images = await buildTargetImages(
      files.filter((f) => f.path.startsWith("stm32g031/")),
      "stm32g031",
      "stm32g031",
    );
    expect(images.map((f) => f.path)).toContain("stm32g031/firmware/firmware.elf");
  }, 120_000);

  it("planted faults: position 1 on the wrong pin, pull-down instead of pull-up", () => {
    expect(problems(header.replace("5u, /* position 1 */", "8u, /* position 1 */")).length).toBeGreaterThan(
      0,
    );
    const pullDown = header.replace(
      /\| (0x[0-9A-F]+)u;/,
      (_, v: string) => `| 0x${(Number(v) << 1).toString(16).toUpperCase().padStart(8, "0")}u;`,
    );
    expect(pullDown).not.toBe(header);
    expect(problems(pullDown).length).toBeGreaterThan(0);
  });
});
