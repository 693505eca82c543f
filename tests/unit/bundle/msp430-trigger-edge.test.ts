// MSP430G2553 triggered firmware: the input edge the plan asks for is the one
// P1IES selects, checked in the generated main.c without mspdebug so the fast
// mutation set judges it (the simulator run is
// tests/unit/firmware/trigger-msp430g2553-sim.test.ts).
// Source: MSP430x2xx Family User's Guide SLAU144, Digital I/O, PxIES: bit = 0
// sets the PxIFG flag on a low-to-high transition, bit = 1 on high-to-low.
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundlePlan } from "@/lib/bundle";
import { msp430g2553TriggerView } from "@/lib/bundle/trigger-msp430g2553";
import { planTarget } from "@/lib/engine";
import { expectEngineError } from "../engine/expect-engine-error";
import { msp430TriggerRequest } from "./fixtures";

function start(edge: "rising" | "falling"): { main: string; bit: string } {
  const files = buildBundleSources({
    retrofit: { name: "Edge check" },
    revision: 1,
    stage: { kind: "timer555-monostable", r: 10e3, c: 1e-6 },
    targets: [msp430TriggerRequest("trigger", { edge })],
  });
  const main = String(files.find((f) => f.path === "msp430g2553/src/main.c")?.content);
  const bit = /P1IE \|= (BIT\d);/.exec(main)?.[1] ?? "none";
  return { main, bit };
}

describe("MSP430G2553 trigger edge in P1IES", () => {
  it("falling: P1IES bit set (high-to-low), never cleared", () => {
    const { main, bit } = start("falling");
    expect(bit).not.toBe("none");
    expect(main).toContain(`P1IES |= ${bit};`);
    expect(main).not.toContain(`P1IES &= (uint8_t)~${bit};`);
  });

  it("rising: P1IES bit cleared (low-to-high), never set", () => {
    const { main, bit } = start("rising");
    expect(main).toContain(`P1IES &= (uint8_t)~${bit};`);
    expect(main).not.toContain(`P1IES |= ${bit};`);
  });
});

// The restart rule belongs to a trigger start only: the engine refuses it on a
// zero-cross start with "retrigger applies to a trigger start; zero crossings
// come once per half cycle." (lib/engine/solver/start.ts, the product's own
// message), and the firmware view keeps to that even for a plan carrying it.
describe("MSP430G2553 retrigger restart", () => {
  const plan = (start: "trigger" | "zero-cross") => planTarget(msp430TriggerRequest(start)) as BundlePlan;

  it("the engine refuses it on a zero-cross start", () => {
    const err = expectEngineError(
      () => planTarget(msp430TriggerRequest("zero-cross", { retrigger: "restart" })),
      "invalid-request",
      "retrigger",
    );
    expect(err.message).toBe(
      "retrigger applies to a trigger start; zero crossings come once per half cycle.",
    );
  });

  it("a trigger start restarts; a zero-cross start never does", () => {
    expect(msp430g2553TriggerView({ ...plan("trigger"), retrigger: "restart" })!.restart).toBe(true);
    expect(msp430g2553TriggerView({ ...plan("zero-cross"), retrigger: "restart" })!.restart).toBe(false);
  });
});
