// The product's STM32G031 emulator wrapper (lib/firmware/emulate/stm32g031.ts)
// on images the product built. Expected numbers are the REQUEST, chosen exact
// on the clock, within half a timer count (firmware.md build contract), with
// RM0444 formulas for what the registers give: counter clock f_TIM/(PSC+1),
// an update every ARR+1 counts, PWM mode 1 high while CNT < CCR1, toggle on
// match halves the rate. The unicorn harness has no counting timer and no
// output unit: the wrapper says so in its reason, and the edges it reports
// are computed, so they are checked against the same formulas here.
import { afterEach, describe, expect, it } from "vitest";
import type { BundleTargetRequest } from "@/lib/bundle";
import { emulateStm32g031 } from "@/lib/firmware/emulate/stm32g031";
import { forgetToolVersions } from "@/lib/firmware/emulate/harness/tool";
import { targetImage } from "./emulate-images";

const PWM: BundleTargetRequest = { device: "stm32g031", clockHz: 64e6, periodS: 1e-3, highS: 0.25e-3 };
const TOGGLE: BundleTargetRequest = {
  device: "stm32g031",
  clockHz: 2e6,
  periodS: 0.01,
  highS: 0.005,
  mode: "toggle",
  timer: "TIM3",
};
const ISR: BundleTargetRequest = {
  device: "stm32g031",
  clockHz: 48e6,
  periodS: 0.5,
  highS: 0.2,
  mode: "isr",
  timer: "TIM3",
};

afterEach(() => {
  delete process.env.CLOCKGRAFT_EMULATORS_OFF;
  delete process.env.CLOCKGRAFT_UNICORN_PYTHON;
  forgetToolVersions();
});

describe("STM32G031 wrapper: real images agree with their plan", () => {
  it("PWM on TIM2 from the PLL at 64 MHz: 1 ms period, 250 us high on PA0", async () => {
    const { input } = await targetImage(PWM);
    const r = await emulateStm32g031(input);
    expect(r.verdict, r.reason).toBe("agrees");
    expect(r.tool).toMatch(/^python3-unicorn \d/);
    expect(r.reason).toMatch(/no counting timer or output unit/); // says the numbers come from registers
    expect(r.periodS).toBeCloseTo(1e-3, 12);
    expect(r.highS).toBeCloseTo(0.25e-3, 12);
    // PWM mode 1 from the counter start: high at 0, low after CCR1 counts, high again after ARR+1 counts.
    expect(r.edges!.slice(0, 3).map((e) => e.level)).toEqual([1, 0, 1]);
    expect(r.edges![1].t).toBeCloseTo(0.25e-3, 12);
    expect(r.edges![2].t).toBeCloseTo(1e-3, 12);
  });

  it("toggle on TIM3 at 2 MHz: two update periods per output period on PA6", async () => {
    const r = await emulateStm32g031((await targetImage(TOGGLE)).input);
    expect(r.verdict, r.reason).toBe("agrees");
    expect(r.periodS).toBeCloseTo(0.01, 12);
    expect(r.edges![1].t - r.edges![0].t).toBeCloseTo(0.005, 12);
  });

  it("interrupt plan on TIM3 at 48 MHz: pin levels written by the handler give 500 ms / 200 ms", async () => {
    const r = await emulateStm32g031((await targetImage(ISR)).input);
    expect(r.verdict, r.reason).toBe("agrees");
    expect(r.reason).toMatch(/called TIM3's handler \d+ times/);
    expect(r.periodS).toBeCloseTo(0.5, 9);
    expect(r.highS).toBeCloseTo(0.2, 9);
    const rise = r.edges!.filter((e) => e.level === 1);
    expect(rise[1].t - rise[0].t).toBeCloseTo(0.5, 9);
    expect(r.emulatedS).toBeGreaterThanOrEqual(1); // two periods of handler calls
  });
});

describe("STM32G031 wrapper: planted faults give differs", () => {
  it("ARR off by one in a PWM image: the period is one count long", async () => {
    const { plan, input } = await targetImage(PWM, {
      file: "src/main.c",
      from: `TIM2->ARR = ${PWM_ARR};`,
      to: `TIM2->ARR = ${PWM_ARR + 1};`,
    });
    expect(plan.registers.ARR).toBe(PWM_ARR);
    const r = await emulateStm32g031(input);
    expect(r.verdict).toBe("differs");
    expect(r.reason).toMatch(/period 1\.000016 ms is 15\.62500 ns off the planned 1\.000000 ms/);
    // One count at 64 MHz, PSC 0: 1/64 MHz = 15.625 ns longer (RM0444: update every ARR+1 counts).
    expect(r.periodS! - 1e-3).toBeCloseTo(1 / 64e6, 15);
  });

  it("ARR off by one in an interrupt plan: every update is one count late", async () => {
    const good = await targetImage(ISR);
    const arr = good.plan.registers.ARR;
    const { input } = await targetImage(ISR, {
      file: "src/main.c",
      from: `TIM3->ARR = ${arr};`,
      to: `TIM3->ARR = ${arr + 1};`,
    });
    const r = await emulateStm32g031(input);
    expect(r.verdict).toBe("differs");
    expect(r.reason).toMatch(/period .* off the planned 500\.0000 ms/);
  });

  it("a missing timer clock enable: the timer writes are dropped and the output never starts", async () => {
    const { input } = await targetImage(PWM, {
      file: "src/main.c",
      from: /\n\s*RCC_APBENR1 \|= \(1u << 0\);[^\n]*/,
      to: "",
    });
    const r = await emulateStm32g031(input);
    expect(r.verdict).toBe("differs");
    expect(r.reason).toMatch(/TIM2 written before RCC_APBENR1 TIM2EN/);
  });
});

const PWM_ARR = 63999; // 64 MHz / 1 kHz - 1 (RM0444: period = (ARR+1)/f_CK_CNT, PSC 0)

describe("STM32G031 wrapper: not emulated, never faked", () => {
  it("CLOCKGRAFT_EMULATORS_OFF=1 runs nothing", async () => {
    const { input } = await targetImage(PWM);
    process.env.CLOCKGRAFT_EMULATORS_OFF = "1";
    const r = await emulateStm32g031(input);
    expect(r).toEqual({ verdict: "not-emulated", reason: expect.stringMatching(/switched off/) });
  });

  it("a deployment without python3-unicorn says so and gives no numbers", async () => {
    const { input } = await targetImage(PWM);
    process.env.CLOCKGRAFT_UNICORN_PYTHON = "/nonexistent/python3";
    const r = await emulateStm32g031(input);
    expect(r.verdict).toBe("not-emulated");
    expect(r.reason).toMatch(/python3-unicorn is not installed for \/nonexistent\/python3/);
    expect(r.periodS).toBeUndefined();
  });

  it("a triggered plan kind without an input to drive is not run", async () => {
    const { input } = await targetImage(PWM);
    const r = await emulateStm32g031({ ...input, kind: "triggered" });
    expect(r.verdict).toBe("not-emulated");
    expect(r.reason).toMatch(/names no port A input to drive/);
  });

  it("a plan kind no wrapper drives is not run", async () => {
    const { input } = await targetImage(PWM);
    const r = await emulateStm32g031({ ...input, kind: "burst" });
    expect(r.verdict).toBe("not-emulated");
    expect(r.reason).toMatch(/this plan is "burst"/);
  });

  it("a run past the wall-clock budget is stopped and not judged", async () => {
    const { input } = await targetImage(PWM);
    const r = await emulateStm32g031({ ...input, timeoutMs: 5 });
    expect(r.verdict).toBe("not-emulated");
    expect(r.reason).toMatch(/took longer than/);
  });
});
