// The product's MSP430G2553 emulator wrapper (lib/firmware/emulate/msp430g2553.ts)
// on images the product built, run in mspdebug's simulator (Debian mspdebug
// 0.22). Expected numbers are the REQUEST, exact on the clock, within half a
// timer count (firmware.md build contract) plus the emulator's own step for
// interrupt plans (6 cycles: the longest MSP430 instruction or interrupt
// acceptance, SLAU144 CPU chapter). Formulas: SLAU144 Timer_A (up mode, a
// period is ID*(TACCR0+1) timer clocks; OUTMOD_7 high for TACCR1 counts).
// The simulator has no Timer_A output unit: PWM high time comes from TACCR1
// (the wrapper says so), the period from the counter's wrap; interrupt plans
// from the simulated times of the handler calls.
import { afterEach, describe, expect, it } from "vitest";
import type { BundleTargetRequest } from "@/lib/bundle";
import { emulateMsp430g2553 } from "@/lib/firmware/emulate/msp430g2553";
import { forgetToolVersions } from "@/lib/firmware/emulate/harness/tool";
import { targetImage } from "./emulate-images";

const PWM: BundleTargetRequest = { device: "msp430g2553", clockHz: 1e6, periodS: 0.02, highS: 0.0015 };
const ISR: BundleTargetRequest = { device: "msp430g2553", clockHz: 1e6, periodS: 2, highS: 0.5, mode: "isr" };
const STEP_S = 6 / 1e6; // emulator step at 1 MHz MCLK

const path = process.env.PATH;
afterEach(() => {
  delete process.env.CLOCKGRAFT_EMULATORS_OFF;
  process.env.PATH = path;
  forgetToolVersions();
});

describe("MSP430G2553 wrapper: real images agree with their plan", () => {
  it("PWM at 1 MHz (calibrated DCO): 20 ms period, 1.5 ms high on P1.2", async () => {
    const r = await emulateMsp430g2553((await targetImage(PWM)).input);
    expect(r.verdict, r.reason).toBe("agrees");
    expect(r.tool).toBe("MSPDebug version 0.22");
    expect(r.reason).toMatch(/no output unit/);
    expect(r.periodS).toBeCloseTo(0.02, 12); // 20000 counts of 1 us (TACCR0 = 19999)
    expect(r.highS).toBeCloseTo(0.0015, 12);
  });

  it("interrupt plan at 1 MHz, ID 8, software divider 4: handler times give 2 s / 0.5 s", async () => {
    const { input } = await targetImage(ISR);
    const r = await emulateMsp430g2553({
      ...input,
      toleranceS: { period: input.toleranceS.period + STEP_S, high: input.toleranceS.high + STEP_S },
    });
    expect(r.verdict, r.reason).toBe("agrees");
    expect(r.reason).toMatch(/simulated times of the handler calls/);
    expect(Math.abs(r.periodS! - 2)).toBeLessThanOrEqual(4e-6 + STEP_S);
    expect(Math.abs(r.highS! - 0.5)).toBeLessThanOrEqual(4e-6 + STEP_S);
    const rises = r.edges!.filter((e) => e.level === 1);
    expect(rises.length).toBeGreaterThanOrEqual(2);
    // Interrupts every 8 * 62500 cycles = 0.5 s (SLAU144): every edge sits on that grid from the first.
    for (const e of r.edges!) {
      const n = (e.t - r.edges![0].t) / 0.5;
      expect(Math.abs(n - Math.round(n))).toBeLessThan(1e-4);
    }
    expect(r.emulatedS).toBeGreaterThan(2);
  });
});

describe("MSP430G2553 wrapper: planted faults give differs", () => {
  it("PWM: TACCR0 one too high makes the period one count long", async () => {
    const { input } = await targetImage(PWM, {
      file: "src/main.c",
      from: "TA0CCR0 = 19999;",
      to: "TA0CCR0 = 20000;",
    });
    const r = await emulateMsp430g2553(input);
    expect(r.verdict).toBe("differs");
    expect(r.periodS).toBeCloseTo(0.020001, 12);
    expect(r.reason).toMatch(/period 20\.00100 ms is 1\.000000 us off the planned 20\.00000 ms/);
  });

  it("interrupt plan: TACCR0 one too high makes each of the 4 intervals 8 cycles long", async () => {
    const { input } = await targetImage(ISR, {
      file: "src/main.c",
      from: "TA0CCR0 = 62499;",
      to: "TA0CCR0 = 62500;",
    });
    const r = await emulateMsp430g2553({
      ...input,
      toleranceS: { period: input.toleranceS.period + STEP_S, high: input.toleranceS.high + STEP_S },
    });
    expect(r.verdict).toBe("differs");
    expect(r.periodS! - 2).toBeCloseTo(32e-6, 7);
  });

  it("the watchdog left running resets the CPU", async () => {
    const { input } = await targetImage(PWM, {
      file: "src/startup.S",
      from: "mov.w #(WDTPW | WDTHOLD), &WDTCTL",
      to: "nop",
    });
    const r = await emulateMsp430g2553(input);
    expect(r.verdict).toBe("differs");
    expect(r.reason).toMatch(/the CPU was reset \d+ times/);
  });
});

describe("MSP430G2553 wrapper: not emulated, never faked", () => {
  it("CLOCKGRAFT_EMULATORS_OFF=1 runs nothing", async () => {
    const { input } = await targetImage(PWM);
    process.env.CLOCKGRAFT_EMULATORS_OFF = "1";
    expect(await emulateMsp430g2553(input)).toEqual({
      verdict: "not-emulated",
      reason: expect.stringMatching(/switched off/),
    });
  });

  it("a deployment without mspdebug says so and gives no numbers", async () => {
    const { input } = await targetImage(PWM);
    process.env.PATH = "/nonexistent";
    forgetToolVersions();
    const r = await emulateMsp430g2553(input);
    expect(r.verdict).toBe("not-emulated");
    expect(r.reason).toMatch(/mspdebug is not installed/);
    expect(r.periodS).toBeUndefined();
  });

  it("a zero-cross plan kind without an input pin to drive is not run", async () => {
    const { input } = await targetImage(PWM);
    const r = await emulateMsp430g2553({ ...input, kind: "zero-cross" });
    expect(r.verdict).toBe("not-emulated");
    expect(r.reason).toMatch(/names no P1 input pin/);
  });
  it("a run past the wall-clock budget is stopped and not judged", async () => {
    const { input } = await targetImage(PWM);
    const r = await emulateMsp430g2553({ ...input, timeoutMs: 5 });
    expect(r.verdict).toBe("not-emulated");
    // Stopped by the cap, or (seen once under heavy load) its output cut short: either way not judged.
    expect(r.reason).toMatch(
      /The simulator run did not finish: the (.* run took longer than \d+ ms|simulator's output ended after)/,
    );
    expect(r.periodS).toBeUndefined();
  });
});
