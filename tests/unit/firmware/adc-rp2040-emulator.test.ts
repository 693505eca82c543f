// A kept rate potentiometer on the RP2040, run in rp2040js (devDependency)
// from the boot ROM hand-over (tests/unit/firmware/rp2040-emulator.ts). The
// ADC model returns rp.adc.channelValues[AINSEL] (12-bit counts) for each
// conversion; the wiper is set to the middle of the ADC step for minimum,
// middle and maximum, and the GPIO0 (PWM slice 0 A) period must equal the old
// stage's period there within one timer count (firmware.md, "Timing of an
// image"). Old stage: 555 astable, T = ln2*(Ra + 2*Rb)*C (NE555 datasheet, TI
// SLFS022). ADC registers: RP2040 datasheet section 4.9. rp2040js does not
// gate the ADC on clk_adc and has no pads model, so the PLL_USB/CLK_ADC set-up
// (48 MHz, datasheet 4.9) is checked by formula and the pad write in the source. Planted faults (kept as negative cases): the wrong ADC
// channel (AINSEL) and the wrong law (table read back to front).
import { describe, expect, it } from "vitest";
import { buildAdcTable, type Stage } from "@/lib/engine";
import { buildBundleSources, type BundleFile } from "@/lib/bundle";
import { renderRp2040Adc } from "@/lib/bundle/adc-rp2040";
import { spec } from "@/tests/unit/bundle/fixtures";
import { buildRp2040, type SourceEdit } from "./rp2040-build";
import { bootAndRun } from "@/lib/firmware/emulate/harness/rp2040-boot";
import { elfFlashContent } from "./rp2040-image-readers";

const CLOCK = 12e6;
const stage: Stage = { kind: "timer555-astable", supplyV: 5, ra: 1e3, rb: 10e3, c: 100e-9 };
const control = { kind: "pot", field: "rb", seriesR: 2.2e3, trackR: 47e3, taper: "linear" } as const;
const table = buildAdcTable({
  stage,
  control,
  device: "rp2040",
  clockHz: CLOCK,
  clockSource: "xosc",
  adcBits: 12,
  steps: 64,
});
const header = renderRp2040Adc({ table, controlText: "rate pot as Rb" });
const longest = table.steps[table.steps.length - 1];
const request = {
  device: "rp2040",
  clockHz: CLOCK,
  clockSource: "xosc",
  periodS: longest.wantS,
  highS: longest.wantHighS,
  mode: "pwm" as const,
};
const countS = table.plan.divider / CLOCK;

// The include lines main.c gets for a kept pot.
const HOOKS: SourceEdit[] = [
  { file: "src/main.c", from: '#include "timing.h"', to: '#include "timing.h"\n#include "adc_control.h"' },
  {
    file: "src/main.c",
    from: /for \(;;\) \{\s*__asm__ volatile\("wfi"\);\s*\}/,
    to: "adc_control_init();\n  for (;;) {\n    adc_control_poll();\n  }",
  },
];

function flash(h: string): Uint8Array {
  const files = [
    ...(buildBundleSources(spec([request as never])) as BundleFile[]),
    { path: "rp2040/src/adc_control.h", content: h },
  ];
  return elfFlashContent(buildRp2040(files, "rp2040", HOOKS).elf).bytes;
}

function periods(image: Uint8Array, k: number): number[] {
  const count = Math.round((k + 0.5) * table.countsPerStep);
  const run = bootAndRun(image, {
    gpio: 0,
    edgesWanted: 16,
    maxNs: 10 * longest.periodS * 1e9 + 200e6,
    setup: (rp) => {
      rp.adc.channelValues[0] = count;
    },
  });
  const rises = run.edges.filter((e) => e.high).map((e) => e.ns * 1e-9);
  // skip the periods started before adc_control_init's first step took effect at a wrap
  return rises.slice(3).map((t, i) => t - rises[i + 2]);
}

function problems(ps: number[], k: number): string[] {
  const want = table.steps[k].wantS;
  const out: string[] = [];
  if (ps.length < 3) out.push(`only ${ps.length} periods`);
  for (const p of ps) if (Math.abs(p - want) > countS) out.push(`period ${p} s, stage ${want} s (step ${k})`);
  return out;
}

describe("RP2040 keeps the rate pot (rp2040js ADC values)", () => {
  const good = flash(header);
  it("sets the ADC up as the datasheet says", () => {
    expect(header).toContain("CLK_ADC_CTRL = (1u << 11) | (0u << 5);");
    expect(header).toContain("ADC_CS = ADC_CS_EN | (0u << 12) | ADC_CS_START_ONCE;");
    // clk_adc = 12 MHz / REFDIV * FBDIV / POSTDIV1 / POSTDIV2 (datasheet PLL section) must be 48 MHz,
    // with the VCO inside 750..1600 MHz
    const refdiv = Number(/PLL_USB_CS = (\d+)u;/.exec(header)![1]);
    const fbdiv = Number(/PLL_USB_FBDIV_INT = (\d+)u;/.exec(header)![1]);
    const [, p1, p2] = /PLL_USB_PRIM = \((\d+)u << 16\) \| \((\d+)u << 12\);/.exec(header)!.map(Number);
    const vco = (12e6 / refdiv) * fbdiv;
    expect(vco).toBeGreaterThanOrEqual(750e6);
    expect(vco).toBeLessThanOrEqual(1600e6);
    expect(vco / p1 / p2).toBe(48e6);
  });
  for (const k of [0, 32, 63])
    it(`period at step ${k} of 63 is the old stage's within one count`, () => {
      expect(problems(periods(good, k), k)).toEqual([]);
    });
  it("planted fault: the wrong ADC channel is caught", () => {
    const bad = header.replace("(0u << 12)", "(1u << 12)");
    expect(bad).not.toBe(header);
    expect(problems(periods(flash(bad), 32), 32).length).toBeGreaterThan(0);
  });
  it("planted fault: the wrong law is caught", () => {
    const bad = header.replace(
      "PWM_CH_TOP(ADJ_SLICE) = adj_top[s];",
      "PWM_CH_TOP(ADJ_SLICE) = adj_top[ADJ_STEPS - 1u - s];",
    );
    expect(bad).not.toBe(header);
    expect(problems(periods(flash(bad), 63), 63).length).toBeGreaterThan(0);
  });
});
