// Device facts a fresh mutation sample (seed 41) found no test reading: the
// header each toolchain's generated C includes, a wiring note on every
// service pin of every package, and the PIC12F1840's interrupt-plan registers.
import { describe, expect, it } from "vitest";
import { listDevices, planTarget } from "@/lib/engine";

const devices = listDevices();

describe("the register header each device's code includes", () => {
  it("names the vendor or toolchain header", () => {
    // avr-libc manual, <avr/io.h>: "AVR device-specific IO definitions", picks the part from -mmcu.
    // gputils: p12f1840.inc ships with gpasm. TI msp430-gcc support files: msp430.h picks the part.
    // STM32CubeG0 CMSIS device header: stm32g031xx.h; pico-sdk: hardware/regs/pwm.h (these two from memory).
    const header = Object.fromEntries(devices.map((d) => [d.id, d.toolchain.header]));
    expect(header).toEqual({
      atmega328p: "avr/io.h",
      attiny85: "avr/io.h",
      stm32g031: "stm32g031xx.h",
      rp2040: "hardware/regs/pwm.h",
      pic12f1840: "p12f1840.inc",
      msp430g2553: "msp430.h",
    });
  });
});

describe("every service pin carries a wiring note", () => {
  // The pin map prints each supply, ground, reset, clock and programming pin with
  // how to wire it; an empty note leaves the technician a bare pin number.
  // (The product's own rule for the pin map, product.md "pin map".)
  for (const d of devices)
    for (const p of d.packages ?? [])
      it(`${d.id} ${p.name}`, () => {
        const bare = p.servicePins.filter((s) => s.notes.trim() === "").map((s) => s.signal);
        expect(p.servicePins.length).toBeGreaterThan(0);
        expect(bare).toEqual([]);
      });
});

describe("PIC12F1840 interrupt plan registers (DS40001441)", () => {
  it("Timer2 interrupt on, CCP1 left out of PWM", () => {
    // Register 7-2/7-4 INTCON: GIE bit 7, PEIE bit 6; PIE1: TMR2IE bit 1. Timer2 T2CON:
    // TMR2ON bit 2, T2CKPS<1:0> 00/01/10/11 = 1:1/1:4/1:16/1:64. An interrupt plan drives the
    // pin from the handler, so CCP1CON (PWM mode 11xx) and CCPR1L are not set.
    const p = planTarget({ device: "pic12f1840", clockHz: 4e6, periodS: 1, highS: 0.3, mode: "isr" });
    expect(p.mode).toBe("isr");
    const prescale = [1, 4, 16, 64][p.registers.T2CON & 3];
    expect(p.registers.T2CON & 4).toBe(4);
    expect(4 * prescale * (p.registers.PR2 + 1)).toBe(p.divider * p.periodCounts);
    expect(p.registers.PIE1).toBe(1 << 1);
    expect(p.registers.INTCON).toBe(0xc0);
    expect(p.registers).not.toHaveProperty("CCP1CON");
    expect(p.registers).not.toHaveProperty("CCPR1L");
  });
});

describe("clock option labels name their frequency", () => {
  // The clock list is how a user picks the oscillator: a fixed-frequency option must say its
  // frequency in the words the datasheets use (8 MHz RC, 128 kHz, 16 MHz PLL, 31 kHz LFINTOSC,
  // 32.768 kHz watch crystal); a variable one at least says what it is.
  for (const d of devices)
    it(d.id, () => {
      for (const c of d.clocks) {
        expect(c.label.trim(), c.id).not.toBe("");
        if (c.hz !== undefined) {
          const words = c.hz >= 1e6 ? `${c.hz / 1e6} MHz` : `${c.hz / 1e3} kHz`;
          expect(c.label, c.id).toContain(words);
        }
      }
    });
});
