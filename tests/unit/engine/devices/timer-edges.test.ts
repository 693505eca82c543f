// Edges of the device tables the sampled mutation run found unjudged: the
// STM32G031 external clock range at its ends, the AVR 8-bit timers' CTC
// registers in interrupt plans, and the STM32G031 compiler target.
import { describe, expect, it } from "vitest";
import { planTarget } from "@/lib/engine";
import {
  EXT_CLOCK_MAX_HZ,
  EXT_CLOCK_MIN_HZ,
  stm32ClockTree,
} from "@/lib/engine/devices/stm32g031-clock-tree";
import { stm32g031 } from "@/lib/engine/devices/stm32g031";

describe("STM32G031 external clock (HSE bypass)", () => {
  it("runs at both ends of 1..48 MHz and at neither side beyond", () => {
    // STM32G031x4/x6/x8 datasheet, high-speed external user clock: fHSE_ext 1 MHz min,
    // 48 MHz max (from memory).
    expect([EXT_CLOCK_MIN_HZ, EXT_CLOCK_MAX_HZ]).toEqual([1e6, 48e6]);
    for (const hz of [1e6, 48e6]) expect(stm32ClockTree("ext-clock", hz)?.kind).toBe("hse-bypass");
    for (const hz of [0.999e6, 48.001e6]) expect(stm32ClockTree("ext-clock", hz)).toBeNull();
  });
});

describe("AVR 8-bit timer in an interrupt plan", () => {
  it("ATmega328P Timer0: CTC with TOP = OCR0A, one interrupt every N * (OCR0A + 1) cycles", () => {
    // ATmega328P datasheet, Timer/Counter0 mode of operation table: WGM02:0 = 010 is CTC with
    // TOP = OCR0A; the compare match A interrupt comes every prescaler * (OCR0A + 1) clocks.
    const plan = planTarget({
      device: "atmega328p",
      timer: "TIMER0",
      mode: "isr",
      clockHz: 16e6,
      periodS: 10e-3,
      highS: 2e-3,
    });
    expect(plan.registers.TCCR0A).toBe(0b10); // WGM01 = 1, WGM00 = 0
    expect(plan.registers.TCCR0B & 0b1000).toBe(0); // WGM02 = 0
    expect(plan.registers.OCR0A).toBe(plan.periodCounts - 1);
    expect(plan.interruptIntervalCycles).toBe(plan.divider * (plan.registers.OCR0A + 1));
  });
});

describe("STM32G031 compiler target", () => {
  it("builds for the Cortex-M0+ in Thumb state", () => {
    // RM0444: the STM32G0 core is an Arm Cortex-M0+, which runs Thumb code only; GCC manual,
    // ARM options: -mcpu=cortex-m0plus, -mthumb.
    expect(stm32g031.toolchain.target.split(/\s+/).sort()).toEqual(["-mcpu=cortex-m0plus", "-mthumb"]);
  });
});
