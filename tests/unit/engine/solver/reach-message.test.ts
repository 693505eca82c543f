// The "Reach:" part of an unreachable-period refusal lists each hardware mode
// the device has, with its shortest and longest period, then the interrupt
// plans' shortest period; a mode the device lacks is left out.
import { describe, expect, it } from "vitest";
import { planTarget } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

const reachOf = (device: string, clockHz: number, periodS: number) =>
  expectEngineError(
    () => planTarget({ device, clockHz, periodS, highS: periodS / 2.5 }),
    "unreachable-period",
  ).message.split("Reach: ")[1];

describe("reach in the unreachable-period refusal", () => {
  it("ATmega328P at 16 MHz: PWM and toggle ranges, interrupt plans from two 500-cycle intervals", () => {
    // ATmega328P datasheet (DS40002061), Timer/Counter1: fast PWM f = f_clk / (N (1 + TOP)),
    // CTC toggle f = f_clk / (2 N (1 + OCR1A)); N up to 1024, TOP up to 65535:
    // 1024 * 65536 / 16 MHz = 4.194 s and twice that, 8.389 s. The shortest, 2 counts at N = 1
    // (TOP = 1), is 0.125 us for both. Interrupt plans: at least 500 cycles per interrupt
    // (engine.md section 3, common practice) and two interrupts per period: 62.5 us.
    expect(reachOf("atmega328p", 16e6, 50e-9)).toBe(
      "pwm 1.25e-7 s to 4.194 s; toggle 1.25e-7 s to 8.389 s; isr from 0.0000625 s.",
    );
  });
  it("RP2040 has no toggle mode: only PWM and interrupt plans are listed", () => {
    // RP2040 datasheet 4.5: the PWM slices count and compare, there is no compare-toggle output.
    const reach = reachOf("rp2040", 125e6, 5e-9);
    expect(reach).toMatch(/^pwm [^;]+ s to [^;]+ s; isr from [^;]+ s\.$/);
    expect(reach).not.toMatch(/toggle|Infinity/);
  });
});
