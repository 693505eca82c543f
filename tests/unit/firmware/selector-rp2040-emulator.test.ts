// A kept selector switch on the RP2040 (golden case kept-selector-555): the
// bundle's rp2040 folder, built by its own Makefile, runs in rp2040js with the
// contact pins driven through rp2040js's GPIO input (setInputValue): open
// contacts high (the pad pull-up), the closed one low. rp2040js keeps the pad
// pull-up as a flag and does not pull the input itself, so the test drives
// every contact pin and reads the PUE/PDE/IE flags the firmware set (RP2040
// datasheet, PADS_BANK0 GPIOx: IE bit 6, PUE bit 3, PDE bit 2).
// Old stage: 555 astable, T = ln2*(Ra + 2*Rb)*C (NE555 datasheet, TI SLFS022),
// C = the selector's value; one PWM count = DIV/f_sys (datasheet PWM section),
// plus one clk_sys cycle for the fractional divider.
// Planted fault (kept as a negative case): position 1 read on GPIO5 instead of GPIO2.
import { describe, expect, it } from "vitest";
import { buildBundleSources } from "@/lib/bundle";
import { buildSelectorTable } from "@/lib/engine";
import { buildTargetImages } from "@/lib/firmware/build-images";
import { bootAndRun, measure } from "@/lib/firmware/emulate/harness/rp2040-boot";
import type { RP2040 } from "rp2040js";
import { GOLDEN_CASES } from "../../golden/cases";
import { elfFlashContent } from "./rp2040-image-readers";

const spec = GOLDEN_CASES.find((c) => c.name === "kept-selector-555")!.spec;
const rp = spec.targets.find((t) => t.device === "rp2040")!;
const table = buildSelectorTable({
  stage: spec.stage,
  control: spec.control,
  device: "rp2040",
  clockHz: rp.clockHz,
  clockSource: rp.clockSource,
});
const sources = buildBundleSources(spec).filter((f) => f.path.startsWith("rp2040/"));
const countS = table.plan.divider / table.plan.clockHz;
const CONTACTS = [2, 3, 4]; // GPIO2..GPIO4 for positions 1..3 (the pin map)
const STORED = 1; // c = 100 nF, the stage's stored value: position 2

async function flashOf(files: typeof sources): Promise<Uint8Array> {
  const images = await buildTargetImages(files, "rp2040", "rp2040");
  const elf = images.find((f) => f.path === "rp2040/firmware/firmware.elf")!.content as Uint8Array;
  return elfFlashContent(elf).bytes;
}

/** Contacts closed (low) from t = 0, and optionally another set from `later.atS`. */
function run(
  flash: Uint8Array,
  closed: number[],
  later?: { atS: number; closed: number[] },
): { periodsS: number[]; highsS: number[]; rp: RP2040 } {
  const set = (r: RP2040, low: number[]) => {
    for (const g of CONTACTS) r.gpio[g].setInputValue(!low.includes(g));
  };
  const runS = (later?.atS ?? 0) + 0.03 + 8 * 3.3e-3;
  const out = bootAndRun(flash, {
    gpio: 0,
    edgesWanted: 1e9,
    maxNs: runS * 1e9,
    setup: (r) => {
      set(r, closed);
      if (later) {
        const clock = r.clock as unknown as { createAlarm(cb: () => void): { schedule(ns: number): void } };
        clock.createAlarm(() => set(r, later.closed)).schedule(later.atS * 1e9);
      }
    },
  });
  // judge the last few periods only (after the 20 ms debounce of the last change)
  const m = measure(out.edges, 0);
  return {
    periodsS: m.periodsNs.slice(-4).map((ns) => ns * 1e-9),
    highsS: m.highsNs.slice(-4).map((ns) => ns * 1e-9),
    rp: out.rp,
  };
}

function misses(r: { periodsS: number[]; highsS: number[] }, index: number): string[] {
  const p = table.positions[index];
  const tol = countS + 1 / table.plan.clockHz;
  if (r.periodsS.length < 3) return [`only ${r.periodsS.length} periods`];
  return [
    ...r.periodsS.filter((x) => Math.abs(x - p.wantS) > tol).map((x) => `period ${x} s, want ${p.wantS} s`),
    ...r.highsS
      .filter((x) => Math.abs(x - p.wantHighS) > tol)
      .map((x) => `high ${x} s, want ${p.wantHighS} s`),
  ];
}

const flash = await flashOf(sources);

describe("RP2040 keeps the selector switch (rp2040js GPIO inputs)", () => {
  for (const k of [0, 1, 2])
    it(`position ${k + 1} closed: the old stage's period for that capacitor within one count`, () => {
      const r = run(flash, [CONTACTS[k]]);
      expect(misses(r, k)).toEqual([]);
      // datasheet input set-up on every contact pin: IE on, pull-up on, pull-down off
      for (const g of CONTACTS) {
        const pin = r.rp.gpio[g] as unknown as {
          pullupEnabled: boolean;
          pulldownEnabled: boolean;
          inputEnable: boolean;
        };
        expect([pin.pullupEnabled, pin.pulldownEnabled, pin.inputEnable], `GPIO${g}`).toEqual([
          true,
          false,
          true,
        ]);
      }
    }, 120_000);

  it("no contact or two contacts at power-up: the stored value's position", () => {
    expect(misses(run(flash, []), STORED)).toEqual([]);
    expect(misses(run(flash, [CONTACTS[0], CONTACTS[2]]), STORED)).toEqual([]);
  }, 120_000);

  it("a move from position 1 to 3 follows; then between contacts the last position is kept", () => {
    expect(misses(run(flash, [CONTACTS[0]], { atS: 0.05, closed: [CONTACTS[2]] }), 2)).toEqual([]);
    expect(misses(run(flash, [CONTACTS[0]], { atS: 0.05, closed: [] }), 0)).toEqual([]);
  }, 120_000);

  it("planted fault: position 1 read on the wrong pin is caught", async () => {
    const bad = sources.map((f) =>
      f.path === "rp2040/src/selector_control.h"
        ? { ...f, content: String(f.content).replace("2u, /* position 1 */", "5u, /* position 1 */") }
        : f,
    );
    expect(bad).not.toEqual(sources);
    const r = run(await flashOf(bad), [CONTACTS[0]]);
    expect(misses(r, 0).length).toBeGreaterThan(0);
  }, 120_000);
});
