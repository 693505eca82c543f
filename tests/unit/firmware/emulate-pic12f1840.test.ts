// The product's PIC12F1840 emulator wrapper (lib/firmware/emulate/pic12f1840.ts)
// on images the product built (gpasm from the bundle's src/main.asm), run in
// gpsim (Debian gpsim 0.31, processor p12f1840). Expected numbers are the
// REQUEST, exact on the clock, within half a timer count (firmware.md build
// contract) plus the emulator's own step: the pin is sampled once per
// instruction, at most two cycles (the idle loop's goto). Formulas:
// DS40001441 CCP chapter, PWM period = (PR2+1)*4*Tosc*prescale, pulse =
// CCPR1L:DC1B*Tosc*prescale; Timer2 interrupt every (PR2+1)*prescale*postscale
// instruction cycles. PWM is measured on the pin itself (gpsim drives CCP1
// onto RA2); interrupt plans from the cycles of the handler's LATA writes.
import { afterEach, describe, expect, it } from "vitest";
import type { BundleTargetRequest } from "@/lib/bundle";
import { emulatePic12f1840 } from "@/lib/firmware/emulate/pic12f1840";
import { forgetToolVersions } from "@/lib/firmware/emulate/harness/tool";
import type { EmulationInput } from "@/lib/firmware/emulate/types";
import { targetImage } from "./emulate-images";

// 16 MHz internal: Tcy 250 ns; 25 us = 100 Tcy (PR2 = 99, prescale 1), 6 us = 24 Tcy.
const PWM: BundleTargetRequest & { clockSource: string } = {
  device: "pic12f1840",
  clockSource: "hfintosc",
  clockHz: 16e6,
  periodS: 25e-6,
  highS: 6e-6,
};
// 16 MHz internal, interrupt plan: 10 ms from a software divider over Timer2 interrupts.
const ISR: BundleTargetRequest & { clockSource: string } = {
  device: "pic12f1840",
  clockSource: "hfintosc",
  clockHz: 16e6,
  periodS: 10e-3,
  highS: 2.5e-3,
  mode: "isr",
};
const TCY = 4 / 16e6;

/**
 * Adds the emulator's step to the half-count tolerance: two instruction cycles for one edge, spread
 * over the 12 periods the wrapper averages for the period (25 us PWM at 16 MHz: 100 Tcy per period).
 */
const withStep = (i: EmulationInput, periods = 12): EmulationInput => ({
  ...i,
  toleranceS: { period: i.toleranceS.period + (2 * TCY) / periods, high: i.toleranceS.high + 2 * TCY },
});

const pr2 = (from: number) => ({
  file: "src/main.asm",
  from: new RegExp(`(movlw\\s+)${from}(\\n\\s+movwf\\s+PR2\\b)`),
  to: `$1${from + 1}$2`,
});

const path = process.env.PATH;
afterEach(() => {
  delete process.env.CLOCKGRAFT_EMULATORS_OFF;
  process.env.PATH = path;
  forgetToolVersions();
});

describe("PIC12F1840 wrapper: real images agree with their plan", () => {
  it("PWM at 16 MHz internal: 25 us period, 6 us high measured on RA2", async () => {
    const { input, plan } = await targetImage(PWM);
    expect(plan.registers.PR2).toBe(99);
    const r = await emulatePic12f1840(withStep(input));
    expect(r.verdict, r.reason).toBe("agrees");
    expect(r.tool).toBe("gpsim-0.31.0");
    expect(r.reason).toMatch(/RA2 was sampled after each of \d+ instructions/);
    expect(Math.abs(r.periodS! - 25e-6)).toBeLessThanOrEqual(TCY / 2 + 2 * TCY);
    expect(Math.abs(r.highS! - 6e-6)).toBeLessThanOrEqual(TCY / 2 + 2 * TCY);
    const rises = r.edges!.filter((e) => e.level === 1);
    expect(Math.abs(rises[1].t - rises[0].t - 25e-6)).toBeLessThanOrEqual(2 * TCY);
  });

  it("interrupt plan at 16 MHz: the handler's LATA writes give 10 ms / 2.5 ms on RA2", async () => {
    const { input } = await targetImage(ISR);
    const r = await emulatePic12f1840(withStep(input, 1));
    expect(r.verdict, r.reason).toBe("agrees");
    expect(r.reason).toMatch(/logged every LATA write/);
    expect(r.periodS).toBeCloseTo(10e-3, 9);
    expect(r.highS).toBeCloseTo(2.5e-3, 9);
  });
});

describe("PIC12F1840 wrapper: planted faults give differs", () => {
  it("PWM: PR2 off by one makes the period one count (250 ns) long", async () => {
    const { input } = await targetImage(PWM, pr2(99));
    const r = await emulatePic12f1840(withStep(input));
    expect(r.reason).toMatch(/mean over 12 periods/);
    expect(r.verdict).toBe("differs");
    expect(Math.abs(r.periodS! - 25.25e-6)).toBeLessThanOrEqual((2 * TCY) / 12);
    expect(r.reason).toMatch(/period 25\.2\d+ us is .* off the planned 25\.00000 us/);
  });

  it("interrupt plan: PR2 off by one makes every interrupt one count late", async () => {
    const good = await targetImage(ISR);
    const { input } = await targetImage(ISR, pr2(good.plan.registers.PR2));
    const r = await emulatePic12f1840(withStep(input, 1));
    expect(r.verdict).toBe("differs");
    expect(r.reason).toMatch(/period .* off the planned 10\.00000 ms/);
  });
});

describe("PIC12F1840 wrapper: not emulated, never faked", () => {
  it("CLOCKGRAFT_EMULATORS_OFF=1 runs nothing", async () => {
    const { input } = await targetImage(PWM);
    process.env.CLOCKGRAFT_EMULATORS_OFF = "1";
    expect(await emulatePic12f1840(input)).toEqual({
      verdict: "not-emulated",
      reason: expect.stringMatching(/switched off/),
    });
  });

  it("a deployment without gpsim says so and gives no numbers", async () => {
    const { input } = await targetImage(PWM);
    process.env.PATH = "/nonexistent";
    forgetToolVersions();
    const r = await emulatePic12f1840(input);
    expect(r.verdict).toBe("not-emulated");
    expect(r.reason).toMatch(/gpsim is not installed/);
    expect(r.periodS).toBeUndefined();
  });

  it("a triggered plan kind without an input pin to drive is not run", async () => {
    const { input } = await targetImage(PWM);
    const r = await emulatePic12f1840({ ...input, kind: "triggered" });
    expect(r.verdict).toBe("not-emulated");
    expect(r.reason).toMatch(/names no PORTA input pin/);
  });
  it("a run past the wall-clock budget is stopped and not judged", async () => {
    const { input } = await targetImage(PWM);
    const r = await emulatePic12f1840({ ...input, timeoutMs: 5 });
    expect(r.verdict).toBe("not-emulated");
    expect(r.reason).toMatch(/The gpsim run did not finish: the .* run took longer than \d+ ms/);
    expect(r.periodS).toBeUndefined();
  });
});
