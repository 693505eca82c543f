// The product's RP2040 emulator wrapper (lib/firmware/emulate/rp2040.ts) runs
// the shipped firmware.elf in rp2040js from the ROM hand-over and judges the
// GPIO against the plan. Expected values: the plan's numbers from the RP2040
// datasheet, PWM chapter (period = (TOP+1) * (PH_CORRECT+1) * DIV / f_sys).
// rp2040js 1.4.1 does not drive phase-correct PWM onto the pin: that plan must
// answer not-emulated (never agrees), with the registers read back.
// Planted fault (kept): TOP one count too high must give "differs".
import { describe, expect, it } from "vitest";
import { formatEng } from "@/lib/engine/units";
import { emulateTarget } from "@/lib/firmware/emulate";
import { built, inputFor, withFault } from "./fixtures";

const EDGE_XOSC = {
  device: "rp2040",
  clockSource: "xosc",
  clockHz: 12e6,
  periodS: 1e-3,
  highS: 0.3e-3,
} as const;
const ISR_PLL = {
  device: "rp2040",
  clockSource: "xosc-pll",
  clockHz: 125e6,
  periodS: 0.01,
  highS: 0.002,
  mode: "isr",
} as const;
const PHASE_PLL = { device: "rp2040", clockHz: 125e6, periodS: 0.02, highS: 0.0015 } as const;

describe("RP2040 emulator wrapper (rp2040js)", () => {
  it.each([
    ["edge-aligned PWM on the crystal, 1 ms / 0.3 ms", EDGE_XOSC],
    ["interrupt plan on the PLL, 10 ms / 2 ms", ISR_PLL],
  ])("%s: agrees", async (_n, req) => {
    const { plan, files } = await built(req);
    expect(plan.modeFactor).toBe(1);
    const r = await emulateTarget(inputFor(plan, files));
    expect(r.reason).toMatch(/^Agrees/);
    expect(r.verdict).toBe("agrees");
    expect(r.tool).toBe("rp2040js 1.4.1");
    expect(r.edges!.length).toBeGreaterThanOrEqual(8);
  });

  it("planted fault: PWM TOP one count too high differs by one count (1/12 MHz)", async () => {
    const { plan, files } = await built(EDGE_XOSC);
    const bad = await withFault(files, "rp2040", "rp2040", (s) =>
      s.replace(
        /PWM_CH_TOP\(TIMING_SLICE\) = (\d+);/,
        (_m, n: string) => `PWM_CH_TOP(TIMING_SLICE) = ${Number(n) + 1};`,
      ),
    );
    const r = await emulateTarget(inputFor(plan, bad));
    expect(r.verdict).toBe("differs");
    expect(r.reason).toMatch(/period by \+83\.333\d* ns/);
  });

  it("phase-correct PWM: not emulated (rp2040js does not drive it), the registers read back give the plan", async () => {
    const { plan, files } = await built(PHASE_PLL);
    expect(plan.modeFactor).toBe(2);
    const r = await emulateTarget(inputFor(plan, files));
    expect(r.verdict).toBe("not-emulated");
    expect(r.reason).toContain("does not drive phase-correct PWM");
    expect(r.reason).toContain(`period of ${formatEng(plan.periodS, "s", 6)}`);
    expect(r.reason).toContain(`high time of ${formatEng(plan.highS, "s", 6)}`);
  });
});
