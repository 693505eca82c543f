// The product's AVR emulator wrapper (lib/firmware/emulate/avr.ts) on
// triggered and zero-cross plans: the shipped firmware.hex runs in simavr
// (Debian libsimavr 1.6) with the input pin driven by
// harness/simavr/trigger-trace.c as lib/firmware/emulate/judge-trigger.ts
// schedules it. Contract (engine.md section 6, as in
// tests/unit/firmware/trigger-avr-simavr.test.ts): after each selected edge one
// pulse, delay = delayCounts counts within one count below and one count plus
// the stated latency above (ATmega328P datasheet DS40002061 "Interrupt Response
// Time", handler cycles from the AVR Instruction Set Manual), width =
// highCounts counts within one count (Timer1 counts at fclk / N, datasheet
// Timer/Counter1 chapter), each widened by one simavr cycle.
// Edge selection: EICRA / MCUCR ISC01:0 (External Interrupts chapters).
// Planted faults (kept): INT0 on rising instead of falling edges, and the
// delay compare two counts long, must each give "differs".
import { describe, expect, it } from "vitest";
import { emulateTarget } from "@/lib/firmware/emulate";
import { built, inputFor, withFault } from "./fixtures";

// The demo's backwash hold-off (db/seed/demo-data.ts): 555 one-shot, 220 kOhm
// and 10 uF, 1.1 R C = 2.42 s pulse (NE555 datasheet, monostable), falling trigger.
const BACKWASH = {
  device: "atmega328p",
  clockHz: 16e6,
  clockSource: "crystal",
  periodS: 10,
  highS: 1.1 * 220e3 * 10e-6,
  start: "trigger",
  delayS: 0,
  edge: "falling",
  retrigger: "ignore",
} as const;
const TRIGGER_328P = {
  device: "atmega328p",
  clockHz: 16e6,
  clockSource: "crystal",
  periodS: 0.2,
  highS: 0.01,
  start: "trigger",
  delayS: 0.02,
  edge: "falling",
} as const;
// 50 Hz mains: a crossing every 10 ms, both edges of the detector's square wave.
const ZERO_CROSS_328P = {
  device: "atmega328p",
  clockHz: 16e6,
  clockSource: "crystal",
  periodS: 0.01,
  highS: 100e-6,
  start: "zero-cross",
  delayS: 3e-3,
} as const;
const TRIGGER_T85 = {
  device: "attiny85",
  clockHz: 8e6,
  clockSource: "rc8m",
  periodS: 0.02,
  highS: 0.002,
  start: "trigger",
  delayS: 0.004,
  edge: "falling",
} as const;

describe("AVR emulator wrapper on triggered and zero-cross plans (simavr)", () => {
  it.each([
    ["ATmega328P trigger, 20 ms delay, 10 ms pulse", TRIGGER_328P, 3],
    ["ATmega328P zero-cross at 50 Hz, both edges", ZERO_CROSS_328P, 3],
    ["ATtiny85 trigger, 4 ms delay, 2 ms pulse", TRIGGER_T85, 3],
    // three edges 3.03 s apart need 8.5 s, over the 7.5 s budget at 16 MHz: two edges
    ["demo backwash hold-off, 2.42 s pulse", BACKWASH, 2],
  ])("%s: agrees with the measured delay and width", async (_n, req, edges) => {
    const { plan, files } = await built(req);
    const r = await emulateTarget(inputFor(plan, files));
    expect(r.reason).toMatch(new RegExp(`^Agrees over ${edges} `));
    expect(r.verdict).toBe("agrees");
    const count = plan.divider / plan.clockHz;
    expect(r.delayS!).toBeGreaterThanOrEqual(plan.delayS! - count);
    expect(r.delayS!).toBeLessThanOrEqual(plan.delayS! + count + plan.latencyS! + 1 / plan.clockHz);
    expect(Math.abs(r.widthS! - plan.highS)).toBeLessThanOrEqual(count + 1 / plan.clockHz);
    expect(r.trigger!.input).toBe(plan.input!.port);
    expect(r.trigger!.inputEdges.length).toBeGreaterThanOrEqual(edges);
    expect(r.edges!.filter((e) => e.level === 1).length).toBe(edges);
  });

  it("planted fault: INT0 on rising edges instead of falling differs", async () => {
    const { plan, files } = await built(TRIGGER_328P);
    const bad = await withFault(files, "atmega328p", "atmega328p", (c) =>
      c.replace("EICRA = (1 << ISC01);", "EICRA = (1 << ISC01) | (1 << ISC00);"),
    );
    const r = await emulateTarget(inputFor(plan, bad));
    expect(r.verdict).toBe("differs");
    expect(r.reason).toMatch(/delay/);
  });

  it("planted fault: delay compare two counts long differs", async () => {
    const { plan, files } = await built(TRIGGER_328P);
    const bad = await withFault(files, "atmega328p", "atmega328p", (c) =>
      c.replace(`OCR1A = ${plan.delayCounts}u;`, `OCR1A = ${plan.delayCounts! + 2}u;`),
    );
    const r = await emulateTarget(inputFor(plan, bad));
    expect(r.verdict).toBe("differs");
    // With TIMER1 at N = 8 the two counts (1 us) sit inside the delay window
    // (one count plus the 37-cycle latency), but the pulse, ended by the
    // unchanged top, comes two counts short: caught on the width.
    expect(r.reason).toMatch(/^Differs .*pulse 9\.99/);
  });

  it("a pulse too long for the budget is not emulated, with the reason", async () => {
    const { plan, files } = await built(TRIGGER_328P);
    const input = inputFor(plan, files);
    const r = await emulateTarget({ ...input, trigger: { ...input.trigger!, widthS: 30 } });
    expect(r.verdict).toBe("not-emulated");
    expect(r.reason).toMatch(/emulator budget is 7\.5 s per target/);
  });
});
