// A kept trimmer is the calibration constant TRIM_PERIOD_COUNTS in
// src/timing.h. Each target folder of the golden case kept-trimmer-555 is
// built twice by the product's image builder (the bundle's own Makefile) with
// two constants a technician could write, and the product's emulator wrapper
// must find the period TRIM_PERIOD_COUNTS x one timer count within half a
// count (firmware.md build contract; the wrappers add their own step), and the
// high time the firmware's rule gives (trimHighCounts). The count length is
// each datasheet's timer law: ATmega328P/ATtiny85 fast PWM f = f_clk/(N*(1+TOP))
// (DS40002061 Timer/Counter1, ATtiny85 Timer/Counter0), RP2040 PWM
// (TOP+1)*DIV/f_sys (datasheet PWM section), STM32G031 (PSC+1)*(ARR+1)/f_TIM
// (RM0444 general-purpose timers), MSP430G2553 ID*(TACCR0+1)/f (SLAU144
// Timer_A up mode). The STM32G031 wrapper computes its edges from the
// registers (the unicorn harness has no counting timer), as it says.
// PIC12F1840 (gpasm image in gpsim): period (PR2+1)*4*Tosc*prescale, duty
// CCPR1L:DC1B quarter counts (DS40001441, CCP PWM).
// Planted fault (kept as a negative case): main.c / main.asm writes the stored
// TOP as a number, ignoring the constant: the emulator must see the stored period.
// Bad input: a constant outside the trimmer's range stops the build with the
// header's own message.
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundlePlan } from "@/lib/bundle";
import type { TrimmerSummary } from "@/lib/bundle/trim-control";
import { buildTrimRange, trimHighCounts, type TimerPlan } from "@/lib/engine";
import { buildTargetImages } from "@/lib/firmware/build-images";
import { emulateTarget } from "@/lib/firmware/emulate";
import { emulationInputOf } from "@/lib/firmware/emulate/plan-input";
import { GOLDEN_CASES } from "../../golden/cases";

const spec = GOLDEN_CASES.find((c) => c.name === "kept-trimmer-555")!.spec;
const sources = buildBundleSources(spec);
const planJson = JSON.parse(String(sources.find((f) => f.path === "plan.json")!.content)) as {
  targets: { folder: string; plan: BundlePlan; control: TrimmerSummary | { kept: false } }[];
};

function edit(folder: string, file: string, from: string, to: string) {
  return sources
    .filter((f) => f.path.startsWith(`${folder}/`))
    .map((f) => {
      if (f.path !== `${folder}/${file}`) return f;
      const next = String(f.content).replace(from, to);
      if (!String(f.content).includes(from)) throw new Error(`${from} not in ${f.path}`);
      return { path: f.path, content: next };
    });
}

async function runWith(folder: string, n: number, plantIgnore = false) {
  const t = planJson.targets.find((x) => x.folder === folder)!;
  const summary = t.control as TrimmerSummary;
  // the technician's edit: the one #define line in the file the checklist names
  const u = summary.file === "src/timing.h" ? "u" : "";
  let files = edit(
    folder,
    summary.file,
    `#define TRIM_PERIOD_COUNTS ${summary.storedCounts}${u}`,
    `#define TRIM_PERIOD_COUNTS ${n}${u}`,
  );
  if (plantIgnore) {
    const [main, top] =
      folder === "pic12f1840"
        ? ["src/main.asm", "(TRIM_PERIOD_COUNTS - 1)"]
        : ["src/main.c", "(TRIM_PERIOD_COUNTS - 1u)"];
    const withFault = edit(folder, main, top, `${summary.storedCounts - 1}`);
    files = files.map((f) => (f.path.endsWith(`/${main}`) ? withFault.find((g) => g.path === f.path)! : f));
  }
  const images = await buildTargetImages(files, folder, t.plan.device);
  const range = buildTrimRange(spec.stage, spec.control, t.plan, folder === "pic12f1840" ? 4 : 1);
  // high in 1/highPerCount counts (PIC12F1840: quarter counts, CCPR1L:DC1B)
  const h = trimHighCounts(range, n);
  const highS = (h / range.highPerCount) * range.countS;
  const plan = { ...t.plan, periodS: n * range.countS, highS } as unknown as TimerPlan;
  const input = emulationInputOf(plan, folder, [...files, ...images], 120_000);
  return { result: await emulateTarget(input), range, n, h };
}

const FOLDERS = ["atmega328p", "attiny85", "rp2040", "stm32g031", "msp430g2553", "pic12f1840"];

describe("kept trimmer: the calibration constant sets the emulated period", () => {
  for (const folder of FOLDERS) {
    const summary = planJson.targets.find((x) => x.folder === folder)!.control as TrimmerSummary;
    // two constants off the stored value, one on each side (each side has its own high-time line)
    const low = summary.minCounts + 7;
    const high = summary.maxCounts - 11;
    it(`${folder}: TRIM_PERIOD_COUNTS = ${low} and ${high} and the stored value give N x one count`, async () => {
      // the stored value too: the image the product itself builds and emulates for the revision
      for (const n of [low, summary.storedCounts, high]) {
        const { result, range } = await runWith(folder, n);
        expect(result.verdict, result.reason).toBe("agrees");
        // half a count + the plan's jitter + one CPU clock (the finest emulator step)
        const plan = t(folder);
        expect(Math.abs(result.periodS! - n * range.countS)).toBeLessThanOrEqual(
          0.5 * range.countS + (plan.jitterS ?? 0) + 1 / plan.clockHz,
        );
      }
    }, 240_000);
  }

  for (const folder of ["atmega328p", "pic12f1840"])
    it(`planted fault (${folder}): the stored TOP written as a number (constant ignored) is caught`, async () => {
      const summary = planJson.targets.find((x) => x.folder === folder)!.control as TrimmerSummary;
      const { result } = await runWith(folder, summary.maxCounts - 11, true);
      expect(result.verdict, result.reason).toBe("differs");
    }, 120_000);

  it("a constant outside the trimmer's range stops the build (avr-gcc #error, gpasm error)", async () => {
    const summary = planJson.targets.find((x) => x.folder === "atmega328p")!.control as TrimmerSummary;
    const files = edit(
      "atmega328p",
      "src/timing.h",
      `#define TRIM_PERIOD_COUNTS ${summary.storedCounts}u`,
      `#define TRIM_PERIOD_COUNTS ${summary.maxCounts + 1}u`,
    );
    await expect(buildTargetImages(files, "atmega328p", "atmega328p")).rejects.toThrow(
      /outside the trimmer's range/,
    );
    const pic = planJson.targets.find((x) => x.folder === "pic12f1840")!.control as TrimmerSummary;
    const picFiles = edit(
      "pic12f1840",
      pic.file,
      `#define TRIM_PERIOD_COUNTS ${pic.storedCounts}`,
      `#define TRIM_PERIOD_COUNTS ${pic.minCounts - 1}`,
    );
    await expect(buildTargetImages(picFiles, "pic12f1840", "pic12f1840")).rejects.toThrow(
      /outside the trimmer's range/,
    );
  }, 120_000);
});

function t(folder: string): BundlePlan {
  return planJson.targets.find((x) => x.folder === folder)!.plan;
}
