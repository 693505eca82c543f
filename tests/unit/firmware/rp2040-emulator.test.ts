// The RP2040 image, booted as the ROM hands over and run in rp2040js
// (npm devDependency, version pinned in package.json), makes the planned
// waveform on its pin. Expected values: the plan's own formula from the
// RP2040 datasheet, PWM chapter (period = (TOP+1)*(PH_CORRECT+1)*DIV/f_sys;
// edge-aligned high while the counter is below CC), times the software
// divider for interrupt plans. Tolerance (firmware.md): half a timer count
// either side plus the emulator's step; interrupt plans may add the
// handler's set/clear path difference (256 clocks at most).
// rp2040js 1.4.1 does not drive phase-correct PWM onto the pin, so those
// plans are checked from the final PWM registers instead.
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleFile } from "@/lib/bundle";
import { spec } from "@/tests/unit/bundle/fixtures";
import { planTarget, type PlanRequest, type TimerPlan } from "@/lib/engine";
import { buildRp2040, type SourceEdit } from "./rp2040-build";
import {
  BootRefused,
  bootAndRun,
  measure,
  type RunOutcome,
} from "@/lib/firmware/emulate/harness/rp2040-boot";
import { elfFlashContent } from "./rp2040-image-readers";

/**
 * The emulator's own step, in clk_sys cycles. Hardware PWM edges come from
 * rp2040js's timer alarms at exact times, so none beyond float rounding;
 * pin writes from an interrupt handler land at instruction boundaries, up to
 * the longest Cortex-M0+ instruction the harness steps over (from memory:
 * loads and stores 2, taken branches 2..3, so 4 is generous).
 */
const PWM_STEP_CYCLES = 1e-6;
const ISR_STEP_CYCLES = 4;
/** firmware.md: an interrupt plan's set and clear paths may differ by up to 256 clocks. */
const ISR_PATH_CYCLES = 256;

const bundle = (req: PlanRequest) => spec([req]);

// One make per request and fault set (a build takes seconds on a shared machine).
const builtFlash = new Map<string, Uint8Array>();
function flashFor(req: PlanRequest, edits: SourceEdit[]): Uint8Array {
  const key = JSON.stringify([req, edits.map((e) => [e.file, String(e.from), String(e.to)])]);
  let flash = builtFlash.get(key);
  if (!flash) {
    const files = buildBundleSources(bundle(req)) as BundleFile[];
    flash = elfFlashContent(buildRp2040(files, "rp2040", edits).elf).bytes;
    builtFlash.set(key, flash);
  }
  return new Uint8Array(flash);
}

function buildAndRun(req: PlanRequest, edits: SourceEdit[], periods: number) {
  const plan = planTarget(req);
  const flash = flashFor(req, edits);
  const cyclesPerPeriod = plan.divider * plan.periodCounts * plan.modeFactor * plan.softwareDivider;
  const maxNs = ((periods + 3) * cyclesPerPeriod * 1e9) / plan.clockHz + 200e6; // + XOSC start-up
  const run = bootAndRun(flash, { gpio: plan.pin.gpio!, edgesWanted: 2 * periods + 2, maxNs });
  return { plan, run };
}

/** Problems with the measured waveform against the plan; empty when it matches. */
function timingProblems(plan: TimerPlan, run: RunOutcome, isr: boolean): string[] {
  const problems: string[] = [];
  if (run.clkSysHz !== plan.clockHz) problems.push(`clk_sys ${run.clkSysHz} Hz, plan ${plan.clockHz} Hz`);
  const m = measure(run.edges);
  if (m.periodsNs.length < 2) return [...problems, `only ${run.edges.length} edges on GPIO${plan.pin.gpio}`];
  const toCycles = (ns: number) => Number(((ns * plan.clockHz) / 1e9).toFixed(3));
  const count = plan.divider; // one counter step in clk_sys cycles
  const wantPeriod = plan.divider * plan.periodCounts * plan.modeFactor * plan.softwareDivider;
  const wantHigh = isr
    ? plan.divider * plan.periodCounts * plan.highCounts
    : plan.divider * plan.highCounts * plan.modeFactor;
  const step = isr ? ISR_STEP_CYCLES : PWM_STEP_CYCLES;
  const tolPeriod = count / 2 + step;
  const tolHigh = count / 2 + step + (isr ? ISR_PATH_CYCLES : 0);
  for (const p of m.periodsNs)
    if (Math.abs(toCycles(p) - wantPeriod) > tolPeriod)
      problems.push(`period ${toCycles(p)} cycles, plan ${wantPeriod} +- ${tolPeriod}`);
  for (const h of m.highsNs)
    if (Math.abs(toCycles(h) - wantHigh) > tolHigh)
      problems.push(`high ${toCycles(h)} cycles, plan ${wantHigh} +- ${tolHigh}`);
  return problems;
}

const EDGE_PLL: PlanRequest = {
  device: "rp2040",
  clockSource: "xosc-pll",
  clockHz: 125e6,
  periodS: 12501 / 125e6,
  highS: 2.5e-5,
};
const EDGE_XOSC: PlanRequest = {
  device: "rp2040",
  clockSource: "xosc",
  clockHz: 12e6,
  periodS: 1e-3,
  highS: 0.3e-3,
};
const EDGE_PLL48: PlanRequest = {
  device: "rp2040",
  clockSource: "xosc-pll",
  clockHz: 48e6,
  periodS: 1e-3,
  highS: 0.25e-3,
};
const ISR_PLL: PlanRequest = {
  device: "rp2040",
  clockSource: "xosc-pll",
  clockHz: 125e6,
  periodS: 0.01,
  highS: 0.002,
  mode: "isr",
};
const PHASE_PLL: PlanRequest = { device: "rp2040", clockHz: 125e6, periodS: 0.02, highS: 0.0015 };

describe("RP2040 image in rp2040js from the boot ROM hand-over", () => {
  it.each([
    ["edge-aligned PWM, PLL 125 MHz", EDGE_PLL],
    ["edge-aligned PWM, crystal direct 12 MHz", EDGE_XOSC],
    ["edge-aligned PWM, PLL 48 MHz", EDGE_PLL48],
  ])("%s: period and high time on the pin match the plan", (_name, req) => {
    const { plan, run } = buildAndRun(req, [], 4);
    expect(plan.modeFactor).toBe(1); // edge-aligned, so rp2040js drives the pin
    expect(timingProblems(plan, run, false)).toEqual([]);
    expect(measure(run.edges).periodsNs.length).toBeGreaterThanOrEqual(2);
    // Stage 2 pointed VTOR at the image's table (RP2040 datasheet, boot stage 2; Armv6-M VTOR at 0xE000ED08)
    expect(run.rp.core.VTOR).toBe(0x10000100);
  });

  it("interrupt plan: the wrap interrupt drives the pin at the planned period and high time", () => {
    const { plan, run } = buildAndRun(ISR_PLL, [], 3);
    expect(plan.mode).toBe("isr");
    expect(plan.softwareDivider).toBeGreaterThan(1);
    expect(timingProblems(plan, run, true)).toEqual([]);
  });

  it("stage 2 leaves the SSI set for 03h execute-in-place reads (RP2040 datasheet, SSI: CTRLR0, SPI_CTRLR0 fields)", () => {
    const { run } = buildAndRun(EDGE_XOSC, [], 2);
    const ssi = (off: number) => run.rp.readUint32(0x18000000 + off);
    // CTRLR0: SPI_FRF (22:21) = 0 standard, DFS_32 (20:16) = 31, TMOD (9:8) = 3 EEPROM read
    expect(ssi(0x00)).toBe((31 << 16) | (3 << 8));
    // SPI_CTRLR0: XIP_CMD (31:24) = 0x03, INST_L (9:8) = 2 (8 bits), ADDR_L (5:2) = 6 (24 bits), TRANS_TYPE 0
    expect(ssi(0xf4) >>> 0).toBe(((0x03 << 24) | (2 << 8) | (6 << 2)) >>> 0);
    expect(ssi(0x08)).toBe(1); // SSIENR
  });

  it("phase-correct plan: final PWM registers give the planned period (rp2040js does not drive this mode onto the pin)", () => {
    const { plan, run } = buildAndRun(PHASE_PLL, [], 0);
    expect(plan.modeFactor).toBe(2);
    const slice = plan.pin.slice!;
    const reg = (off: number) => run.rp.readUint32(0x40050000 + 0x14 * slice + off);
    const csr = reg(0x00);
    const div = reg(0x04);
    const top = reg(0x10);
    const cc = reg(0x0c) & 0xffff;
    expect(csr & 3).toBe(3); // EN | PH_CORRECT
    const divider = (div >> 4) + (div & 15) / 16;
    // RP2040 datasheet, PWM: period = (TOP+1) * (PH_CORRECT+1) * DIV / f_sys; phase-correct high = 2 * CC * DIV / f_sys
    expect(((top + 1) * 2 * divider) / run.clkSysHz).toBeCloseTo(plan.periodS, 12);
    expect((2 * cc * divider) / run.clkSysHz).toBeCloseTo(plan.highS, 12);
    expect(run.clkSysHz).toBe(125e6);
  });

  describe("planted faults the harness must catch", () => {
    it("stage-2 CRC one bit off: the ROM check refuses to boot", () => {
      const flash = flashFor(EDGE_XOSC, []);
      flash[252] ^= 0x01;
      expect(() => bootAndRun(flash, { gpio: 0, edgesWanted: 4, maxNs: 1e7 })).toThrow(BootRefused);
      flash[252] ^= 0x01;
      flash[10] ^= 0x80; // a code bit instead of a CRC bit
      expect(() => bootAndRun(flash, { gpio: 0, edgesWanted: 4, maxNs: 1e7 })).toThrow(/CRC mismatch/);
    });

    it("PWM block left in reset (no RESETS release): the pin never moves", () => {
      const { plan, run } = buildAndRun(
        EDGE_XOSC,
        [
          {
            file: "src/main.c",
            from: "RESETS_RESET_CLR = RESETS_IO_BANK0 | RESETS_PADS_BANK0 | RESETS_PWM;",
            to: "RESETS_RESET_CLR = RESETS_IO_BANK0 | RESETS_PADS_BANK0;",
          },
          {
            file: "src/main.c",
            from: /while \(\(RESETS_RESET_DONE & \(RESETS_IO_BANK0 \| RESETS_PADS_BANK0 \| RESETS_PWM\)\)[^\n]*\n  \}\n/,
            to: "",
          },
        ],
        2,
      );
      expect(run.droppedWrites["0x40050"]).toBeGreaterThan(0);
      expect(timingProblems(plan, run, false).join(" ")).toMatch(/only \d+ edges/);
    });

    it("TOP off by one: the period is one count long", () => {
      const { plan, run } = buildAndRun(
        EDGE_XOSC,
        [
          {
            file: "src/main.c",
            from: /PWM_CH_TOP\(TIMING_SLICE\) = (\d+);/,
            to: (m) => m.replace(/= (\d+);/, (_x, n: string) => `= ${Number(n) + 1};`),
          },
        ],
        3,
      );
      expect(timingProblems(plan, run, false).join(" ")).toMatch(/period 12001 cycles, plan 12000/);
    });
  });
});
