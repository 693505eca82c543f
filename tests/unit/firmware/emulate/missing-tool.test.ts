// Emulation never fakes a result: with the emulators switched off, with gcc
// (needed for the simavr harness) not on PATH, or for a device without a
// wrapper, every answer is "not-emulated" with a plain reason.
import { afterEach, describe, expect, it } from "vitest";
import { emulateTarget } from "@/lib/firmware/emulate";
import { built, inputFor } from "./fixtures";

const PWM_328P = { device: "atmega328p", clockHz: 16e6, periodS: 0.02, highS: 0.0015, mode: "pwm" } as const;
const EDGE_XOSC = {
  device: "rp2040",
  clockSource: "xosc",
  clockHz: 12e6,
  periodS: 1e-3,
  highS: 0.3e-3,
} as const;

describe("missing emulators answer not-emulated, never agrees", () => {
  const savedPath = process.env.PATH;
  afterEach(() => {
    delete process.env.CLOCKGRAFT_EMULATORS_OFF;
    process.env.PATH = savedPath;
  });

  it("CLOCKGRAFT_EMULATORS_OFF=1: AVR and RP2040 targets are not emulated", async () => {
    const avr = await built(PWM_328P);
    const rp = await built(EDGE_XOSC);
    // the same inputs agree with the emulators on (positive control for this test)
    expect((await emulateTarget(inputFor(avr.plan, avr.files))).verdict).toBe("agrees");
    process.env.CLOCKGRAFT_EMULATORS_OFF = "1";
    for (const r of [
      await emulateTarget(inputFor(avr.plan, avr.files)),
      await emulateTarget(inputFor(rp.plan, rp.files)),
    ]) {
      expect(r.verdict).toBe("not-emulated");
      expect(r.reason).toContain("CLOCKGRAFT_EMULATORS_OFF=1");
      expect(r.periodS).toBeUndefined();
    }
  });

  it("PATH without gcc: the AVR target is not emulated and names the package", async () => {
    const avr = await built(PWM_328P);
    process.env.PATH = "/nonexistent";
    const r = await emulateTarget(inputFor(avr.plan, avr.files));
    expect(r.verdict).toBe("not-emulated");
    expect(r.reason).toMatch(/gcc is not installed \(Debian package gcc\)/);
  });

  it("a device without a wrapper: 'No emulator wired for <device>'", async () => {
    const avr = await built(PWM_328P);
    const r = await emulateTarget({ ...inputFor(avr.plan, avr.files), device: "attiny13a" });
    expect(r).toEqual({ verdict: "not-emulated", reason: "No emulator wired for attiny13a." });
  });
});
