// The product's AVR emulator wrapper (lib/firmware/emulate/avr.ts) runs the
// shipped firmware.hex in simavr (Debian libsimavr 1.6) and judges the pin
// against the plan. Expected values: the plan's own numbers, from the
// ATmega328P datasheet (Timer/Counter1 fast PWM mode 14: f = fclk / (N * (1 + TOP)))
// and the ATtiny25/45/85 datasheet (Timer/Counter0 fast PWM mode 7, TOP = OCR0A).
// Tolerance: half a count plus one cycle plus jitter (lib/firmware/emulate/plan-input.ts,
// firmware.md "Timing of an image"). Planted faults (kept): TOP one count too
// high and too low must give "differs"; a pin never driven must give "differs".
import { describe, expect, it } from "vitest";
import { emulateTarget } from "@/lib/firmware/emulate";
import { built, inputFor, withFault } from "./fixtures";

const PWM_328P = {
  device: "atmega328p",
  clockHz: 16e6,
  periodS: 0.02,
  highS: 0.0015,
  mode: "pwm",
  clockSource: "crystal",
} as const;
const ISR_328P = { ...PWM_328P, periodS: 0.05, highS: 0.01, mode: "isr" } as const;
const PWM_T85 = {
  device: "attiny85",
  clockHz: 8e6,
  periodS: 2e-3,
  highS: 0.5e-3,
  mode: "pwm",
  timer: "TIMER0",
  clockSource: "rc8m",
} as const;

describe("AVR emulator wrapper (simavr)", () => {
  it.each([
    ["ATmega328P Timer1 fast PWM, 20 ms / 1.5 ms", PWM_328P],
    ["ATmega328P interrupt plan, 50 ms / 10 ms", ISR_328P],
    ["ATtiny85 Timer0 fast PWM, 2 ms / 0.5 ms", PWM_T85],
  ])("%s: agrees, with the measured numbers and the first edges", async (_n, req) => {
    const { plan, files } = await built(req);
    const r = await emulateTarget(inputFor(plan, files));
    expect(r.reason).toMatch(/^Agrees/);
    expect(r.verdict).toBe("agrees");
    expect(r.tool).toMatch(/simavr/);
    expect(Math.abs(r.periodS! - plan.periodS)).toBeLessThanOrEqual(plan.divider / plan.clockHz);
    expect(Math.abs(r.highS! - plan.highS)).toBeLessThanOrEqual(
      plan.divider / plan.clockHz + 256 / plan.clockHz,
    );
    expect(r.edges!.length).toBeGreaterThanOrEqual(8);
    expect(r.edges![0].level).toBe(1);
    expect(r.emulatedS!).toBeGreaterThanOrEqual(4 * plan.periodS);
  });

  it("planted fault: ICR1 (TOP) one count too high differs in the period", async () => {
    const { plan, files } = await built(PWM_328P);
    const top = plan.registers.ICR1;
    const bad = await withFault(files, "atmega328p", "atmega328p", (s) =>
      s.replace(`ICR1 = ${top};`, `ICR1 = ${top + 1};`),
    );
    const r = await emulateTarget(inputFor(plan, bad));
    expect(r.verdict).toBe("differs");
    // one count of Timer1 at N = 8, 16 MHz: 0.5 us (datasheet formula above)
    expect(r.reason).toMatch(/period by \+500 ns/);
  });

  it("planted fault: ATtiny85 OCR0A (TOP) one count too low differs", async () => {
    const { plan, files } = await built(PWM_T85);
    const top = plan.registers.OCR0A;
    const bad = await withFault(files, "attiny85", "attiny85", (s) =>
      s.replace(`OCR0A = ${top};`, `OCR0A = ${top - 1};`),
    );
    const r = await emulateTarget(inputFor(plan, bad));
    expect(r.verdict).toBe("differs");
    expect(r.reason).toMatch(/period by -/);
  });

  it("planted fault: output driver never enabled (no DDR write) differs: no edges", async () => {
    const { plan, files } = await built(PWM_328P);
    const bad = await withFault(files, "atmega328p", "atmega328p", (s) =>
      s.replace(/^\s*DDRB \|= \(1 << DDB1\);$/m, ""),
    );
    const r = await emulateTarget(inputFor(plan, bad));
    expect(r.verdict).toBe("differs");
    expect(r.reason).toMatch(/PB1 showed 0 edges/);
  });

  it("a period beyond the emulation budget is not emulated, with the reason", async () => {
    const { plan, files } = await built(PWM_328P);
    const input = inputFor(plan, files);
    // (3 + 2.5) x 1.5 s = 8.25 s emulated; the budget is 120 M cycles = 7.5 s at 16 MHz.
    const r = await emulateTarget({ ...input, planned: { ...input.planned, periodS: 1.5 } });
    expect(r.verdict).toBe("not-emulated");
    expect(r.reason).toMatch(/needs 8\.25 s of emulated time; the emulator budget is 7\.5 s/);
  });

  it("a kind the wrapper cannot drive is not emulated, with the reason", async () => {
    const { plan, files } = await built(PWM_328P);
    const r = await emulateTarget({ ...inputFor(plan, files), kind: "burst" });
    expect(r).toMatchObject({ verdict: "not-emulated" });
    expect(r.reason).toMatch(/not burst/);
  });
});
