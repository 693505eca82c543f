// STM32G031 clock options are honest for the package: the TSSOP-20 (F suffix)
// has PC14-OSC_IN but no OSC_OUT (DS12992, STM32G031Fx TSSOP20 pinout), so
// no crystal is offered; the timers have no LSE clock path (RM0444, TIM2/TIM3
// clock sources), so no LSE option. What the form is offered is what the
// engine accepts, and an impossible combination is refused naming the field.
import { describe, expect, it } from "vitest";
import { buildBundleSources } from "@/lib/bundle";
import { isEngineError, listDevices, planTarget, type PlanRequest } from "@/lib/engine";
import { flashLatency, stm32ClockTree } from "@/lib/engine/devices/stm32g031-clock-tree";
import { targetSchema } from "@/lib/validation/target";
import { spec } from "../../bundle/fixtures";

const info = listDevices().find((d) => d.id === "stm32g031")!;
const base: PlanRequest = { device: "stm32g031", clockHz: 16e6, periodS: 1e-3, highS: 0.25e-3 };

function refusal(r: Partial<PlanRequest>): { field?: string; message: string } {
  try {
    planTarget({ ...base, ...r });
  } catch (e) {
    if (isEngineError(e)) return { field: e.field, message: e.message };
    throw e;
  }
  throw new Error(`accepted ${JSON.stringify(r)}`);
}

describe("STM32G031 clock options", () => {
  it("offers HSI16 and an external clock on OSC_IN only: no crystal, no LSE", () => {
    expect(info.clocks.map((c) => c.id)).toEqual(["hsi16", "ext-clock"]);
    expect(info.clocks.some((c) => c.kind === "crystal")).toBe(false);
    expect(info.packages?.[0].name).toBe("TSSOP-20");
  });

  it("every HSI16 frequency the form is offered is a legal RM0444 clock tree and plans", () => {
    const hsi = info.clocks.find((c) => c.id === "hsi16")!;
    const list = hsi.frequenciesHz!;
    // HSISYS = 16 MHz / 2^HSIDIV, HSIDIV 0..7 (RM0444 RCC_CR)
    for (let k = 0; k <= 7; k++) expect(list).toContain(16e6 / 2 ** k);
    expect(list).toContain(64e6); // 16 MHz * 8 / 2, the PLL's top (PLLRCLK at most 64 MHz)
    // RM0444 RCC_PLLCFGR: PLLRCLK at most 64 MHz (from memory), so nothing above it
    // is offered; and only whole numbers of Hz (the list's own rule, stm32g031-clock-tree.ts).
    expect(Math.max(...list)).toBe(64e6);
    expect(list.filter((hz) => !Number.isInteger(hz))).toEqual([]);
    for (const hz of list) {
      const t = stm32ClockTree("hsi16", hz)!;
      expect(t.sysclkHz).toBe(hz);
      if (t.kind === "pll") {
        // RM0444 RCC_PLLCFGR: M 1..8, N 8..86, R 2..8; VCO input 2.66-16 MHz, VCO 64-344 MHz (from memory)
        const fin = 16e6 / t.pllM;
        expect(fin).toBeGreaterThanOrEqual(2.66e6);
        expect(fin).toBeLessThanOrEqual(16e6);
        expect(t.pllN).toBeGreaterThanOrEqual(8);
        expect(t.pllN).toBeLessThanOrEqual(86);
        expect(t.pllR).toBeGreaterThanOrEqual(2);
        expect(t.pllR).toBeLessThanOrEqual(8);
        expect(fin * t.pllN).toBeGreaterThanOrEqual(64e6);
        expect(fin * t.pllN).toBeLessThanOrEqual(344e6);
        expect((fin * t.pllN) / t.pllR).toBe(hz);
      } else {
        expect(t.kind).toBe("hsisys");
      }
    }
    expect(planTarget({ ...base, clockHz: 48e6 }).clockSource).toBe("hsi16");
  });

  it("the default source runs on the default package (HSI16)", () => {
    expect(planTarget(base).clockSource).toBe("hsi16");
    expect(planTarget(base).pin.package).toBe("TSSOP-20");
  });

  it("flash wait states follow RM0444 FLASH_ACR LATENCY (0 to 24 MHz, 1 to 48 MHz, 2 to 64 MHz)", () => {
    expect([16e6, 24e6, 24.5e6, 48e6, 48.5e6, 64e6].map(flashLatency)).toEqual([0, 0, 1, 1, 2, 2]);
  });

  it("refuses impossible combinations naming the field", () => {
    // 7 MHz: below the PLL's lowest output (64 MHz VCO / 8) and not 16 MHz / 2^k
    expect(refusal({ clockHz: 7e6 })).toMatchObject({ field: "clockHz" });
    expect(refusal({ clockHz: 7e6 }).message).toMatch(/cannot make 7000000 Hz/);
    expect(refusal({ clockHz: 65e6 })).toMatchObject({ field: "clockHz" });
    // HSE user clock 1-48 MHz (DS12992, from memory)
    expect(refusal({ clockSource: "ext-clock", clockHz: 50e6 })).toMatchObject({ field: "clockHz" });
    expect(refusal({ clockSource: "hse", clockHz: 8e6 })).toMatchObject({ field: "clockSource" });
    expect(refusal({ clockSource: "lse" })).toMatchObject({ field: "clockSource" });
    expect(refusal({ clockSource: "lse", clockHz: 32768 })).toMatchObject({ field: "clockHz" }); // below 125 kHz
    expect(refusal({ package: "DIP-8" })).toMatchObject({ field: "package" });
    expect(planTarget({ ...base, package: "TSSOP-20" }).pin.package).toBe("TSSOP-20");
  });

  it("an external clock on OSC_IN plans at the stated accuracy", () => {
    const p = planTarget({ ...base, clockSource: "ext-clock", clockHz: 12e6, clockAccuracyPpm: 25 });
    expect(p.clockSource).toBe("ext-clock");
    expect(p.clockAccuracyPpm).toBe(25);
  });

  it("the bundle refuses before generating anything", () => {
    expect(() =>
      buildBundleSources(
        spec([{ device: "stm32g031", clockHz: 50e6, clockSource: "ext-clock", periodS: 1e-3, highS: 2e-4 }]),
      ),
    ).toThrow(/target 1 \(stm32g031\) cannot be planned: .*50000000 Hz cannot be made/);
  });

  it("the form refuses an HSI16 frequency the part cannot make, naming clockHz", () => {
    const r = targetSchema.safeParse({ device: "stm32g031", clockSource: "hsi16", clockHz: "7M" });
    expect(r.success).toBe(false);
    expect(r.error?.issues.map((i) => i.path.join("."))).toContain("clockHz");
    expect(
      targetSchema.safeParse({ device: "stm32g031", clockSource: "hsi16", clockHz: "64M" }).success,
    ).toBe(true);
  });
});

describe("STM32G031 TSSOP-20 service pins (DS12992 TSSOP20 pinout)", () => {
  const pins = info.packages![0].servicePins;
  const bySignal = (s: string) => pins.find((p) => p.signal === s)?.packagePins;
  it("supply, ground, reset, SWD and the clock input carry the datasheet's pin numbers", () => {
    expect(bySignal("VDD/VDDA")).toEqual([4]);
    expect(bySignal("VSS/VSSA")).toEqual([5]);
    expect(bySignal("NRST")).toEqual([6]);
    expect(bySignal("SWDIO")).toEqual([18]);
    expect(bySignal("SWCLK")).toEqual([19]);
    expect(bySignal("OSC_IN")).toEqual([2]);
    expect(pins.some((p) => p.role === "crystal")).toBe(false); // no OSC_OUT on this package
  });
});
