// MSP430G2553 triggered firmware: the shortest delay it takes. After the
// TACCR0 match the stop handler needs up to 6 cycles to finish the
// instruction in progress, 6 to accept the interrupt, 4 for the bic.b to
// P1OUT and 5 for the mov.w #imm to TA0CTL: 21 cycles (MSP430x2xx Family
// User's Guide SLAU144, interrupt acceptance and the format I instruction
// cycle table; counts from memory, as MSP430_STOP_CYCLES in
// lib/bundle/trigger-msp430g2553.ts). Up mode has rolled TAR back to 0 by
// then, so TACCR1 (the delay) must lie beyond those 21 cycles: 22 is the
// shortest delay, and the refusal names it.
import { describe, expect, it } from "vitest";
import type { BundlePlan } from "@/lib/bundle";
import { MSP430_STOP_CYCLES, msp430g2553TriggerView } from "@/lib/bundle/trigger-msp430g2553";
import { planTarget } from "@/lib/engine";
import { expectEngineError } from "../engine/expect-engine-error";
import { msp430TriggerRequest } from "./fixtures";

// 1 MHz calibrated DCO, input divider 1: one count is one cycle, so a delay of n us is n cycles
const plan = (delayS: number) => planTarget(msp430TriggerRequest("trigger", { delayS })) as BundlePlan;

describe("MSP430G2553 triggered firmware: shortest delay", () => {
  it("the stop handler's count is 6 + 6 + 4 + 5 = 21 cycles", () => {
    expect(MSP430_STOP_CYCLES).toBe(21);
  });

  it("a 21-cycle delay is refused, naming the 22 cycles the handler needs", () => {
    const p = plan(21e-6);
    expect([p.delayCounts, p.divider]).toEqual([21, 1]);
    const err = expectEngineError(() => msp430g2553TriggerView(p), "unreachable-period");
    expect(err.field).toBe("delayS");
    expect(err.message).toBe(
      "msp430g2553: a delay of 21 cycles is shorter than the handler needs to stop the timer after the pulse (22 cycles); ask for a longer delay.",
    );
  });

  it("a 22-cycle delay is taken: TACCR1 = 22", () => {
    const p = plan(22e-6);
    expect(p.delayCounts).toBe(22);
    expect(msp430g2553TriggerView(p)!.ccr1).toBe(22);
  });
});
