// Triggered and zero-cross firmware on the RP2040 (engine.md section 6), run
// in rp2040js with the input GPIO driven by the test (GPIOPin.setInputValue)
// and the output pin's edges timed (./rp2040-trigger-run.ts).
// Contract checked: each selected input edge is followed by one output pulse;
// delay = delayCounts counts within one count (the slice's divider phase) plus
// the plan's latencyCycles; width = highCounts counts within one count.
// Sources: RP2040 datasheet 2.19 GPIO (IO_BANK0 INTRx / PROC0_INTEx, EDGE_HIGH
// and EDGE_LOW bits, cleared by writing 1; IRQ 13 IO_IRQ_BANK0) and 4.5 PWM
// (counter, CC, TOP, wrap interrupt IRQ 4, A_INV); latency basis in
// lib/engine/solver/trigger-inputs.ts (Cortex-M0+ exception entry, the
// handler's own cycles).
// Emulator limits seen here (rp2040js 1.4.1): exception entry takes fewer
// cycles than the 15 the plan budgets, so the delay shows the lower end of
// the latency; the PWM output changes only at its compare and wrap events,
// so a restart during the pulse (real silicon: the pin follows counter < CC
// at once and the pulse is cut) is not shown: the restart runs below retrigger
// during the delay, which the emulator does show.
import { describe, expect, it } from "vitest";
import type { BundleTargetRequest } from "@/lib/bundle";
import {
  badPulses,
  leadingEdges,
  pulsesAfterRp,
  runRp2040Trigger,
  squareWave,
  type InputStep,
} from "./rp2040-trigger-run";

type Target = BundleTargetRequest & Record<string, unknown>;

const XOSC = { device: "rp2040", clockHz: 12e6, clockSource: "xosc" } as const;
const MS = 1e6; // ns

describe("RP2040 triggered firmware in rp2040js", () => {
  it.each([50, 60])("zero-cross at %i Hz: one pulse after every crossing (both half cycles)", (hz) => {
    const halfS = 1 / (2 * hz);
    const target: Target = {
      ...XOSC,
      periodS: halfS,
      highS: 100e-6,
      start: "zero-cross",
      delayS: 0.3 * halfS,
      edge: "both",
    };
    const inputs = squareWave(20 * MS, halfS * 1e9, 6);
    const r = runRp2040Trigger(target, inputs);
    const pulses = pulsesAfterRp(r, inputs);
    expect(pulses).toHaveLength(6);
    expect(badPulses(r.plan, pulses)).toEqual([]);
    expect(leadingEdges(r)).toHaveLength(6);
  });

  // A contact that bounces: rising at 20 ms, falling 21 ms, rising again 21.5 ms
  // (inside the 4 ms delay), falling 22 ms; a clean second trigger at 40 ms.
  const bounce: InputStep[] = [
    { ns: 20 * MS, high: true },
    { ns: 21 * MS, high: false },
    { ns: 21.5 * MS, high: true },
    { ns: 22 * MS, high: false },
    { ns: 40 * MS, high: true },
    { ns: 41 * MS, high: false },
  ];
  const trigger = (retrigger: "ignore" | "restart"): Target => ({
    ...XOSC,
    periodS: 0.02,
    highS: 0.001,
    start: "trigger",
    delayS: 0.004,
    edge: "rising",
    retrigger,
  });

  it("trigger on rising edges, ignore rule: the rise during the delay changes nothing", () => {
    const r = runRp2040Trigger(trigger("ignore"), bounce);
    const pulses = pulsesAfterRp(r, [bounce[0], bounce[4]]);
    expect(badPulses(r.plan, pulses)).toEqual([]);
    expect(leadingEdges(r)).toHaveLength(2);
  });

  it("trigger on rising edges, restart rule: the rise during the delay starts it again", () => {
    const r = runRp2040Trigger(trigger("restart"), bounce);
    const pulses = pulsesAfterRp(r, [bounce[2], bounce[4]]);
    expect(badPulses(r.plan, pulses)).toEqual([]);
    expect(leadingEdges(r)).toHaveLength(2);
  });

  it("trigger on falling edges through PLL_SYS at 48 MHz, slice divider above 1", () => {
    const target: Target = {
      device: "rp2040",
      clockHz: 48e6,
      periodS: 0.02,
      highS: 0.002,
      start: "trigger",
      delayS: 0.005,
      edge: "falling",
    };
    const inputs = squareWave(20 * MS, 10 * MS, 4); // rises at 20 and 40 ms, falls at 30 and 50 ms
    const r = runRp2040Trigger(target, inputs);
    expect(r.plan.divider).toBeGreaterThan(1);
    const falls = inputs.filter((s) => !s.high);
    expect(badPulses(r.plan, pulsesAfterRp(r, falls))).toEqual([]);
    expect(leadingEdges(r)).toHaveLength(2);
  });

  // Planted faults: the harness must catch each one.
  it("catches a wrong edge (EDGE_LOW enabled for a rising-edge plan)", () => {
    const inputs = squareWave(20 * MS, 10 * MS, 4);
    const r = runRp2040Trigger(trigger("ignore"), inputs, [
      {
        file: "src/main.c",
        from: /(\/\* PROC0_INTE EDGE_HIGH \*\/\n\s+REG32\(0x[0-9A-F]+u\) = )0x80000000u/,
        to: "$10x40000000u",
      },
    ]);
    const rises = inputs.filter((s) => s.high);
    expect(badPulses(r.plan, pulsesAfterRp(r, rises)).length).toBeGreaterThan(0);
  });

  it("catches a delay just past the limit (one count plus the latency, plus one)", () => {
    const inputs = squareWave(20 * MS, 10 * MS, 4);
    const good = runRp2040Trigger(trigger("ignore"), inputs);
    const { delayCounts, divider, latencyCycles } = good.plan;
    const extra = Math.ceil((divider + latencyCycles!) / divider) + 1;
    const r = runRp2040Trigger(trigger("ignore"), inputs, [
      {
        file: "src/main.c",
        from: `PWM_CH_CC(0) = ${delayCounts}u;`,
        to: `PWM_CH_CC(0) = ${delayCounts! + extra}u;`,
      },
    ]);
    const rises = inputs.filter((s) => s.high);
    expect(badPulses(good.plan, pulsesAfterRp(good, rises))).toEqual([]);
    expect(badPulses(r.plan, pulsesAfterRp(r, rises)).length).toBeGreaterThan(0);
  });
});
