// The product's STM32G031 wrapper (lib/firmware/emulate/stm32g031.ts) on
// triggered and zero-cross plans, in the python3-unicorn harness. The harness
// has no counting timer (tests/unit/firmware/trigger-stm32g031-registers.test.ts
// says the same): it raises EXTI1 for each scheduled input change as the EXTI
// would and runs the handler; each pulse is computed from the handler's
// TIM2_CR1 store and TIM2's PSC, CCR1, ARR (RM0444 general-purpose timer:
// one-pulse mode, PWM mode 2, counter clock f / (PSC + 1); EXTI RTSR1/FTSR1
// select the edge). The pin's own timing and the exception entry are not
// emulated; the register checks stand in for them.
// Planted faults (kept): FTSR1 set instead of RTSR1 (wrong edge) and CCR1 two
// counts long must each give "differs".
import { describe, expect, it } from "vitest";
import { emulateTarget } from "@/lib/firmware/emulate";
import { built, expectTriggerAgrees, inputFor, withFault } from "./fixtures";

// 50 Hz mains: a crossing every 10 ms, both edges.
const ZERO_CROSS = {
  device: "stm32g031",
  clockHz: 16e6,
  periodS: 0.01,
  highS: 100e-6,
  start: "zero-cross",
  delayS: 0.003,
  edge: "both",
} as const;
const TRIGGER = {
  device: "stm32g031",
  clockHz: 16e6,
  periodS: 0.02,
  highS: 0.001,
  start: "trigger",
  delayS: 0.004,
  edge: "rising",
  retrigger: "ignore",
} as const;

describe("STM32G031 wrapper on triggered and zero-cross plans (unicorn harness)", () => {
  it.each([
    ["zero-cross at 50 Hz, 3 ms delay, 100 us pulse", ZERO_CROSS],
    ["rising trigger, 4 ms delay, 1 ms pulse", TRIGGER],
  ])("%s: agrees with the computed delay and width", (_n, req) => expectTriggerAgrees(req, { input: "PA1" }));

  it("planted fault: FTSR1 instead of RTSR1 (falling for a rising trigger) differs", async () => {
    const { plan, files } = await built(TRIGGER);
    const bad = await withFault(files, "stm32g031", "stm32g031", (c) =>
      c.replace("EXTI_RTSR1 |=", "EXTI_FTSR1 |="),
    );
    const r = await emulateTarget(inputFor(plan, bad));
    expect(r.verdict).toBe("differs");
  });

  it("planted fault: CCR1 two counts long differs", async () => {
    const { plan, files } = await built(TRIGGER);
    const bad = await withFault(files, "stm32g031", "stm32g031", (c) =>
      c.replace(`->CCR1 = ${plan.delayCounts}u;`, `->CCR1 = ${plan.delayCounts! + 2}u;`),
    );
    const r = await emulateTarget(inputFor(plan, bad));
    expect(r.verdict).toBe("differs");
  });
});
