// STM32G031 timer output pin: when a plan's pin carries no alternate function
// number, the bundle falls back to the timer's own (lib/bundle/device-stm32g031.ts):
// STM32G031x4/x6/x8 datasheet DS12992, alternate function table: PA0 TIM2_CH1
// on AF2, PA6 TIM3_CH1 on AF1 (from memory); the engine's pin table states the
// same numbers, and the fallback must agree with it. GPIOx_AFRL holds four bits
// per pin (RM0444, GPIO alternate function low register).
import { describe, expect, it } from "vitest";
import type { BundlePlan } from "@/lib/bundle";
import { stm32g031View } from "@/lib/bundle/device-stm32g031";
import { planTarget } from "@/lib/engine";

const plan = (timer: "TIM2" | "TIM3") =>
  planTarget({
    device: "stm32g031",
    clockHz: 16e6,
    periodS: 0.02,
    highS: 0.0015,
    mode: "pwm",
    timer,
  }) as BundlePlan;

describe.each([
  ["TIM2", "PA0", 2],
  ["TIM3", "PA6", 1],
] as const)("%s output on %s", (timer, port, af) => {
  it(`is AF${af} in the engine's pin table`, () => {
    const p = plan(timer);
    expect(p.pin.port).toBe(port);
    expect(p.pin.alternateFunction).toBe(af);
    expect(stm32g031View(p).extra).toMatchObject({ tim: timer, af });
  });

  it(`falls back to AF${af} when the pin carries no number`, () => {
    const p = plan(timer);
    const bare = { ...p, pin: { ...p.pin, alternateFunction: undefined } };
    expect(stm32g031View(bare).extra).toMatchObject({ tim: timer, af });
  });
});
