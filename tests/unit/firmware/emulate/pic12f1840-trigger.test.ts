// The product's PIC12F1840 wrapper (lib/firmware/emulate/pic12f1840.ts) on
// triggered and zero-cross plans: the shipped firmware.hex runs in gpsim
// (Debian gpsim 0.31, p12f1840) with RA1 driven by a gpsim stimulus as
// lib/firmware/emulate/judge-trigger.ts schedules it; the pulses are the
// handler's LATA writes. Contract as in
// tests/unit/firmware/trigger-pic12f1840-gpsim.test.ts (PIC12(L)F1840
// datasheet DS40001441: interrupt-on-change IOCAP/IOCAN select the edge,
// Timer2 counts at Fosc/4/prescale; the plan's latency from the datasheet's
// interrupt latency and the counted handler): delay within one count below
// and one count plus the latency above, width within one count, each widened
// by one instruction cycle (gpsim's step).
// Planted faults (kept): IOCAP/IOCAN swapped (wrong edge) and the delay's
// PR2 two counts long must each give "differs".
import { describe, expect, it } from "vitest";
import { emulateTarget } from "@/lib/firmware/emulate";
import { built, expectTriggerAgrees, inputFor, withFault } from "./fixtures";

// 50 Hz mains: a crossing every 10 ms, both edges of a square-wave detector.
const ZERO_CROSS = {
  device: "pic12f1840",
  clockHz: 4e6,
  periodS: 0.01,
  highS: 2e-4,
  start: "zero-cross",
  edge: "both",
  delayS: 0.005,
} as const;
const TRIGGER = {
  device: "pic12f1840",
  clockHz: 4e6,
  periodS: 0.01,
  highS: 5e-4,
  start: "trigger",
  edge: "rising",
  delayS: 0.002,
  retrigger: "ignore",
} as const;

describe("PIC12F1840 wrapper on triggered and zero-cross plans (gpsim)", () => {
  it.each([
    ["zero-cross at 50 Hz, 5 ms delay, 200 us pulse", ZERO_CROSS],
    ["rising trigger, 2 ms delay, 500 us pulse", TRIGGER],
  ])("%s: agrees with the measured delay and width", (_n, req) =>
    expectTriggerAgrees(req, { input: "RA1", stepS: (plan) => 4 / plan.clockHz }),
  );

  it("planted fault: IOCAP and IOCAN swapped (falling instead of rising) differs", async () => {
    const { plan, files } = await built(TRIGGER);
    const bad = await withFault(
      files,
      "pic12f1840",
      "pic12f1840",
      (asm) =>
        asm
          .replace(/movlw\s+0x02\n(\s+movwf\s+IOCAP)/, "movlw   0x00\n$1")
          .replace(/movlw\s+0x00\n(\s+movwf\s+IOCAN)/, "movlw   0x02\n$1"),
      "src/main.asm",
    );
    const r = await emulateTarget(inputFor(plan, bad));
    expect(r.verdict).toBe("differs");
  });

  it("planted fault: the delay's PR2 two counts long differs", async () => {
    const { plan, files } = await built(ZERO_CROSS);
    const bad = await withFault(
      files,
      "pic12f1840",
      "pic12f1840",
      (asm) =>
        asm.replace(
          /movlw\s+(\d+)\n(\s+movwf\s+PR2\s+; the delay's match)/,
          (_, n: string, rest: string) => `movlw   ${Number(n) + 2}\n${rest}`,
        ),
      "src/main.asm",
    );
    const r = await emulateTarget(inputFor(plan, bad));
    expect(r.verdict).toBe("differs");
    expect(r.reason).toMatch(/delay/);
  });
});
