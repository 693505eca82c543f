// The bundle of a stage with a kept rate pot builds its images with each
// device's toolchain, byte for byte the same twice, and the RP2040 image the
// bundle itself ships (no edits applied by the test) follows the pot in
// rp2040js at minimum, middle and maximum within one timer count of the plan.
// Old stage: 555 astable, T = ln2*(Ra + 2*Rb)*C (NE555 datasheet, TI SLFS022).
// rp2040js returns rp.adc.channelValues[AINSEL] for each conversion; it has
// no clk_adc gate, so the clock set-up is checked in adc-rp2040-emulator.test.ts.
// Planted fault (kept as a negative case): the same bundle without the
// control ships the fixed-period image, and the harness sees it miss the
// minimum and maximum of the travel.
import { describe, expect, it } from "vitest";
import { buildAdcTable } from "@/lib/engine";
import { buildBundleFiles } from "@/lib/firmware/bundle";
import { GOLDEN_CASES } from "../../golden/cases";
import { bootAndRun } from "@/lib/firmware/emulate/harness/rp2040-boot";
import { elfFlashContent } from "./rp2040-image-readers";

const spec = GOLDEN_CASES.find((c) => c.name === "kept-pot-555")!.spec;
const rp = spec.targets[2];
const table = buildAdcTable({
  stage: spec.stage,
  control: spec.control,
  device: "rp2040",
  clockHz: rp.clockHz,
  clockSource: rp.clockSource,
  adcBits: 12,
  steps: 64,
});
const first = await buildBundleFiles(spec);
const second = await buildBundleFiles(spec);
const plain = await buildBundleFiles({ ...spec, control: null });
const countS = table.plan.divider / table.plan.clockHz;

function periods(files: typeof first, k: number): number[] {
  const elf = files.find((f) => f.path === "rp2040/firmware/firmware.elf")!.content as Uint8Array;
  const count = Math.round((k + 0.5) * table.countsPerStep);
  const longest = Math.max(...table.steps.map((s) => s.periodS));
  const run = bootAndRun(elfFlashContent(elf).bytes, {
    gpio: 0, // the plan's pin: GPIO0, PWM slice 0 A
    edgesWanted: 16,
    maxNs: 10 * longest * 1e9 + 200e6,
    setup: (rp) => {
      rp.adc.channelValues[0] = count;
    },
  });
  const rises = run.edges.filter((e) => e.high).map((e) => e.ns * 1e-9);
  return rises.slice(3).map((t, i) => t - rises[i + 2]);
}

function misses(ps: number[], k: number): string[] {
  const want = table.steps[k].wantS;
  if (ps.length < 3) return [`only ${ps.length} periods`];
  return ps
    .filter((p) => Math.abs(p - want) > countS)
    .map((p) => `period ${p} s, stage ${want} s (step ${k})`);
}

describe("kept rate pot: images", () => {
  it("every target has its images, identical on a second build", () => {
    const images = first.filter((f) => f.path.includes("/firmware/"));
    for (const folder of ["atmega328p", "attiny85", "rp2040", "stm32g031"])
      expect(
        images.some((f) => f.path.startsWith(`${folder}/firmware/`)),
        folder,
      ).toBe(true);
    for (const f of images) {
      const again = second.find((g) => g.path === f.path);
      expect(again && Buffer.from(again.content).equals(Buffer.from(f.content)), f.path).toBe(true);
    }
  });
  for (const k of [0, 32, 63])
    it(`the shipped RP2040 image follows the pot at step ${k} of 63`, () => {
      expect(misses(periods(first, k), k)).toEqual([]);
    });
  it("planted fault: the fixed-period image is caught at both ends of the travel", () => {
    expect(misses(periods(plain, 0), 0).length).toBeGreaterThan(0);
    expect(misses(periods(plain, 63), 63).length).toBeGreaterThan(0);
  });
});
