// RP2040 clock sources: only what main.c sets up, at frequencies the
// hardware makes. Sources: RP2040 datasheet, PLL section (f = FREF / REFDIV *
// FBDIV / (POSTDIV1 * POSTDIV2); FREF / REFDIV >= 5 MHz; FBDIV 16..320; VCO
// 750..1600 MHz; POSTDIV 1..7), XOSC section (STARTUP DELAY in units of 256
// crystal periods; the worked example gives 47 for 1 ms at 12 MHz), and the
// 133 MHz top clk_sys.
import { describe, expect, it } from "vitest";
import { buildBundleSources } from "@/lib/bundle";
import { EngineError, listDevices, planTarget, type PlanRequest } from "@/lib/engine";
import {
  RP2040_PLL_FREQUENCIES_HZ,
  rp2040PllSetting,
  rp2040XoscStartupDelay,
} from "@/lib/engine/devices/rp2040-clocks";
import { defaultTarget, targetSchema } from "@/lib/validation/target";
import { spec } from "@/tests/unit/bundle/fixtures";

/** The test's own brute force over every REFDIV 1 PLL setting the datasheet allows, any POSTDIV order. */
function bruteForcePll(): Set<number> {
  const out = new Set<number>();
  for (let fbdiv = 16; fbdiv <= 320; fbdiv++)
    for (let p1 = 1; p1 <= 7; p1++)
      for (let p2 = 1; p2 <= 7; p2++) {
        const vco = 12e6 * fbdiv;
        const f = vco / (p1 * p2);
        if (vco >= 750e6 && vco <= 1600e6 && Number.isInteger(f) && f <= 133e6) out.add(f);
      }
  return out;
}

function refusal(fn: () => unknown): EngineError {
  try {
    fn();
  } catch (e) {
    if (e instanceof EngineError) return e;
    throw e;
  }
  throw new Error("expected a refusal");
}

describe("RP2040 PLL_SYS from the 12 MHz crystal", () => {
  it("offers exactly the integer-Hz frequencies the datasheet's PLL limits allow (brute force, REFDIV 1)", () => {
    const want = [...bruteForcePll()].sort((a, b) => a - b);
    expect([...RP2040_PLL_FREQUENCIES_HZ]).toEqual(want);
  });

  it("125 MHz: FBDIV 125 (VCO 1500 MHz), POSTDIV1 6, POSTDIV2 2 (the datasheet's usual 125 MHz set-up, from memory)", () => {
    expect(rp2040PllSetting(125e6)).toEqual({
      refdiv: 1,
      fbdiv: 125,
      postdiv1: 6,
      postdiv2: 2,
      vcoHz: 1500e6,
    });
  });

  it("every setting it returns obeys the limits and makes its frequency", () => {
    for (const hz of RP2040_PLL_FREQUENCIES_HZ) {
      const s = rp2040PllSetting(hz)!;
      expect(s.vcoHz).toBe(12e6 * s.fbdiv);
      expect(s.vcoHz).toBeGreaterThanOrEqual(750e6);
      expect(s.vcoHz).toBeLessThanOrEqual(1600e6);
      expect(s.postdiv1).toBeGreaterThanOrEqual(s.postdiv2);
      expect(s.postdiv1).toBeLessThanOrEqual(7);
      expect(s.vcoHz / (s.postdiv1 * s.postdiv2)).toBe(hz);
    }
  });

  it("16 MHz cannot be made (VCO 750..1600 MHz would need POSTDIV1*POSTDIV2 = 47..100): refused naming clockHz", () => {
    expect(rp2040PllSetting(16e6)).toBeUndefined();
    const e = refusal(() =>
      planTarget({ device: "rp2040", clockSource: "xosc-pll", clockHz: 16e6, periodS: 1e-3, highS: 0.25e-3 }),
    );
    expect(e.code).toBe("clock-out-of-range");
    expect(e.field).toBe("clockHz");
    expect(e.message).toMatch(/16000000 Hz/);
  });

  it("an impossible clock is refused before any bundle file is made", () => {
    // clockSource travels through BundleSpec.targets unchanged (firmware.md)
    const req: PlanRequest = {
      device: "rp2040",
      clockSource: "xosc-pll",
      clockHz: 16e6,
      periodS: 0.02,
      highS: 0.0015,
    };
    const e = refusal(() => buildBundleSources(spec([req])));
    expect(e.code).toBe("clock-out-of-range");
    expect(e.field).toBe("targets.0"); // the bundle names the target; the engine's message names the field
    expect(e.message).toMatch(/Clock frequency 16000000 Hz/);
  });
});

describe("RP2040 crystal direct and the offered options", () => {
  it("the crystal runs at 12 MHz only; 13 MHz is refused naming clockHz", () => {
    expect(
      planTarget({ device: "rp2040", clockSource: "xosc", clockHz: 12e6, periodS: 1e-3, highS: 0.3e-3 })
        .clockHz,
    ).toBe(12e6);
    const e = refusal(() =>
      planTarget({ device: "rp2040", clockSource: "xosc", clockHz: 13e6, periodS: 1e-3, highS: 0.3e-3 }),
    );
    expect(e.field).toBe("clockHz");
  });

  it("an unknown source (the ring oscillator is not offered) is refused naming clockSource", () => {
    const e = refusal(() =>
      planTarget({ device: "rp2040", clockSource: "rosc", clockHz: 12e6, periodS: 1e-3, highS: 0.3e-3 }),
    );
    expect(e.field).toBe("clockSource");
  });

  it("listDevices carries each source's makeable frequencies for the form", () => {
    const rp = listDevices().find((d) => d.id === "rp2040")!;
    expect(rp.clocks.map((c) => c.id)).toEqual(["xosc", "xosc-pll"]);
    expect(rp.clocks[0].frequenciesHz).toEqual([12e6]);
    expect(rp.clocks[1].frequenciesHz).toEqual([...RP2040_PLL_FREQUENCIES_HZ]);
  });

  it("a new RP2040 target in the form is valid and plans", () => {
    const t = targetSchema.parse({ ...defaultTarget("rp2040"), periodS: "1m", highS: "250u" });
    expect(() => planTarget({ ...t, device: "rp2040", periodS: 1e-3, highS: 0.25e-3 })).not.toThrow();
  });

  it("the form refuses a frequency the chosen source cannot make, on clockHz", () => {
    const r = targetSchema.safeParse({
      ...defaultTarget("rp2040"),
      clockSource: "xosc-pll",
      clockHz: "16e6",
    });
    expect(r.success).toBe(false);
    expect(r.error!.issues.some((i) => i.path.join(".") === "clockHz")).toBe(true);
  });

  it("XOSC start-up: 1 ms at 12 MHz is 47 units of 256 periods (datasheet example), times 64 margin, inside the 14-bit field", () => {
    expect(rp2040XoscStartupDelay(12e6)).toBe(47 * 64);
    expect(rp2040XoscStartupDelay(15e6)).toBeLessThanOrEqual(0x3fff);
  });
});
