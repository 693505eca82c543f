// Pin facts against the datasheets' pinout tables, register bit values
// against the register descriptions.
import { describe, expect, it } from "vitest";
import { listDevices, planTarget } from "@/lib/engine";

const plan = (device: string, timer: string, mode: "pwm" | "toggle" | "isr", clockHz = 8e6) =>
  planTarget({ device, timer, mode, clockHz, periodS: 1e-3, highS: 0.25e-3 });

describe("listDevices", () => {
  it("lists the six devices with clocks, timers and pins", () => {
    const d = listDevices();
    expect(d.map((x) => x.id)).toEqual([
      "atmega328p",
      "attiny85",
      "stm32g031",
      "rp2040",
      "pic12f1840",
      "msp430g2553",
    ]);
    for (const x of d) {
      expect(x.clocks.length).toBeGreaterThan(0);
      expect(x.timers.length).toBeGreaterThan(0);
      for (const t of x.timers) expect(t.pins.length).toBeGreaterThan(0);
    }
  });
});

describe("pin facts", () => {
  it("ATmega328P 28-pin PDIP (DS40002061 pin configurations): PB1/OC1A = 15, PD6/OC0A = 12, PD5/OC0B = 11, PB3/OC2A = 17, PD3/OC2B = 5", () => {
    expect(plan("atmega328p", "TIMER1", "pwm").pin).toMatchObject({
      port: "PB1",
      function: "OC1A",
      packagePin: 15,
      package: "PDIP-28",
    });
    expect(plan("atmega328p", "TIMER0", "toggle").pin).toMatchObject({
      port: "PD6",
      function: "OC0A",
      packagePin: 12,
    });
    expect(plan("atmega328p", "TIMER0", "pwm").pin).toMatchObject({
      port: "PD5",
      function: "OC0B",
      packagePin: 11,
    });
    expect(plan("atmega328p", "TIMER2", "toggle").pin).toMatchObject({
      port: "PB3",
      function: "OC2A",
      packagePin: 17,
    });
    expect(plan("atmega328p", "TIMER2", "pwm").pin).toMatchObject({
      port: "PD3",
      function: "OC2B",
      packagePin: 5,
    });
  });

  it("ATtiny85 8-pin PDIP (ATtiny25/45/85 datasheet pinout): PB0/OC0A = 5, PB1/OC0B = 6, PB1/OC1A = 6", () => {
    expect(plan("attiny85", "TIMER0", "toggle").pin).toMatchObject({
      port: "PB0",
      function: "OC0A",
      packagePin: 5,
    });
    expect(plan("attiny85", "TIMER0", "pwm").pin).toMatchObject({
      port: "PB1",
      function: "OC0B",
      packagePin: 6,
    });
    expect(plan("attiny85", "TIMER1", "pwm").pin).toMatchObject({
      port: "PB1",
      function: "OC1A",
      packagePin: 6,
    });
  });

  it("PIC12F1840 8-pin PDIP: RA2/CCP1 = pin 5 (datasheet pin diagram)", () => {
    expect(plan("pic12f1840", "TIMER2", "pwm", 32e6).pin).toMatchObject({
      port: "RA2",
      function: "CCP1",
      packagePin: 5,
    });
  });

  it("MSP430G2553 20-pin PDIP: P1.2/TA0.1 = pin 4, P1SEL = 1, P1SEL2 = 0 (SLAS735 pin functions)", () => {
    expect(plan("msp430g2553", "TIMER0_A3", "pwm").pin).toMatchObject({
      port: "P1.2",
      function: "TA0.1",
      packagePin: 4,
      sel: 1,
      sel2: 0,
    });
  });

  // ST's pin data for the STM32G031 (alternate function table); DS12992 TSSOP20 pinout: PA0 pin 7, PA6 pin 13.
  it("STM32G031 TIM2_CH1 = PA0 AF2 pin 7, TIM3_CH1 = PA6 AF1 pin 13 on the TSSOP-20", () => {
    const p2 = plan("stm32g031", "TIM2", "pwm", 64e6).pin;
    const p3 = plan("stm32g031", "TIM3", "pwm", 64e6).pin;
    expect(p2).toMatchObject({ port: "PA0", function: "TIM2_CH1", alternateFunction: 2, packagePin: 7 });
    expect(p3).toMatchObject({ port: "PA6", function: "TIM3_CH1", alternateFunction: 1, packagePin: 13 });
    expect(p2.package).toBe("TSSOP-20");
  });

  it("RP2040: slice = (gpio >> 1) & 7, channel = gpio & 1, FUNCSEL 4 = PWM (RP2040 datasheet; QFN-56 pin locations)", () => {
    for (let s = 0; s < 8; s++) {
      const p = plan("rp2040", `PWM${s}`, "pwm", 125e6).pin;
      expect(p.slice).toBe((p.gpio! >> 1) & 7);
      expect(p.channel).toBe((p.gpio! & 1) === 0 ? "A" : "B");
      expect(p.slice).toBe(s);
      expect(p.funcSel).toBe(4);
      expect(p.fromMemory).toBe(false); // RP2040 datasheet, pin locations (QFN-56), checked against a public pin table
    }
  });
});

describe("register values from the datasheet bit positions", () => {
  it("ATtiny85 TCCR1: CTC1 bit 7, PWM1A bit 6, COM1A1 bit 5, COM1A0 bit 4, CS13:10 = log2(N) + 1", () => {
    const p = planTarget({
      device: "attiny85",
      timer: "TIMER1",
      clockHz: 8e6,
      periodS: 1e-3,
      highS: 0.25e-3,
    });
    // 8000 cycles = 32 * 250: CS1 = 0110 (CK/32)
    expect([p.divider, p.periodCounts]).toEqual([32, 250]);
    expect(p.registers).toEqual({ TCCR1: 0x40 | 0x20 | 6, OCR1C: 249, OCR1A: 61 });
    const isr = plan("attiny85", "TIMER1", "isr");
    expect(isr.registers.TIMSK).toBe(0x40); // OCIE1A bit 6
    expect(isr.registers.TCCR1 & 0x80).toBe(0x80);
    expect(plan("attiny85", "TIMER0", "isr").registers.TIMSK).toBe(0x10); // OCIE0A bit 4
    // compare toggle: CTC1 (clear at OCR1C) and COM1A1:0 = 01 (toggle OC1A), the bit 4 the title names
    const toggle = planTarget({
      device: "attiny85",
      timer: "TIMER1",
      mode: "toggle",
      clockHz: 8e6,
      periodS: 2e-3,
      highS: 1e-3,
    });
    expect(toggle.registers.TCCR1).toBe(0x80 | 0x10 | 6);
  });

  it("STM32 toggle: OC1M = 011, period 2(PSC+1)(ARR+1)/f (RM0444 output compare toggle)", () => {
    const p = planTarget({
      device: "stm32g031",
      timer: "TIM3",
      mode: "toggle",
      clockHz: 64e6,
      periodS: 1e-3,
      highS: 0.5e-3,
    });
    expect(p.registers.CCMR1).toBe(0x30);
    expect(p.periodS).toBeCloseTo((2 * (p.registers.PSC + 1) * (p.registers.ARR + 1)) / 64e6, 15);
    expect(p.modeFactor).toBe(2);
  });

  it("MSP430 TACTL: TASSEL_2 = 0x0200, ID_3 = 0x00C0, MC_1 = 0x0010 (SLAU144 Timer_A registers)", () => {
    // 30 ms at 16 MHz = 480000 cycles: only ID = 8 fits 16 bits (TACCR0 + 1 = 60000)
    const p = planTarget({ device: "msp430g2553", clockHz: 16e6, periodS: 0.03, highS: 0.01 });
    expect(p.registers.TACTL).toBe(0x0200 | 0x00c0 | 0x0010);
    expect(p.registers.TACCR0).toBe(59999);
  });
});
