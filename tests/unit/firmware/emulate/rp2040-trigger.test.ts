// The product's RP2040 wrapper (lib/firmware/emulate/rp2040.ts) on triggered
// and zero-cross plans: the shipped firmware.elf boots in rp2040js with the
// input GPIO driven (GPIOPin.setInputValue) as
// lib/firmware/emulate/judge-trigger.ts schedules it. Contract as in
// tests/unit/firmware/trigger-rp2040-emulator.test.ts (RP2040 datasheet 2.19
// GPIO: PROC0_INTEx EDGE_HIGH / EDGE_LOW select the edge; 4.5 PWM: the slice
// counts at clk_sys / DIV, CC and TOP; latency basis in
// lib/engine/solver/trigger-inputs.ts): delay within one count below and one
// count plus the stated latency above, width within one count, each widened
// by one clk_sys cycle.
// Planted fault (kept): EDGE_LOW enabled instead of EDGE_HIGH on a rising
// trigger must give "differs".
import { describe, expect, it } from "vitest";
import { emulateTarget } from "@/lib/firmware/emulate";
import { built, expectTriggerAgrees, inputFor, withFault } from "./fixtures";

const XOSC = { device: "rp2040", clockHz: 12e6, clockSource: "xosc" } as const;
// 50 Hz mains: a crossing every 10 ms, both edges.
const ZERO_CROSS = {
  ...XOSC,
  periodS: 0.01,
  highS: 100e-6,
  start: "zero-cross",
  delayS: 0.003,
  edge: "both",
} as const;
const TRIGGER = {
  ...XOSC,
  periodS: 0.02,
  highS: 0.001,
  start: "trigger",
  delayS: 0.004,
  edge: "rising",
  retrigger: "ignore",
} as const;

describe("RP2040 wrapper on triggered and zero-cross plans (rp2040js)", () => {
  it.each([
    ["zero-cross at 50 Hz, 3 ms delay, 100 us pulse", ZERO_CROSS],
    ["rising trigger, 4 ms delay, 1 ms pulse", TRIGGER],
  ])("%s: agrees with the measured delay and width", (_n, req) => expectTriggerAgrees(req));

  it("planted fault: EDGE_LOW enabled instead of EDGE_HIGH differs", async () => {
    const { plan, files } = await built(TRIGGER);
    const bad = await withFault(files, "rp2040", "rp2040", (c) =>
      c.replace(/(\/\* PROC0_INTE EDGE_HIGH \*\/\n\s+REG32\(0x[0-9A-F]+u\) = )0x80000000u/, "$10x40000000u"),
    );
    const r = await emulateTarget(inputFor(plan, bad));
    expect(r.verdict).toBe("differs");
  });
});
