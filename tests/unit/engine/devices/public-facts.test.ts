// The public device view (listDevices) against facts typed here from the
// datasheets, not from the device files: each timer's count range, the
// compiler and target per core, and the service pins of each package. Written
// for mutants a sampled mutation run left alive (a count range taken from the
// wrong end, a package's supply pin list emptied, a compiler name blanked).
import { describe, expect, it } from "vitest";
import { listDevices } from "@/lib/engine";

const devices = listDevices();
const device = (id: string) => devices.find((d) => d.id === id)!;
const timer = (id: string, name: string) => device(id).timers.find((t) => t.name === name)!;
const pinsOf = (id: string) =>
  Object.fromEntries(device(id).packages![0].servicePins.map((s) => [s.signal, s.packagePins]));

describe("count ranges: the shortest period any mode of the timer allows", () => {
  it("ATmega328P Timer1: 1 count (CTC with OCR1A = 0), not fast PWM's 4", () => {
    // ATmega328P datasheet DS40002061, Timer/Counter1: in CTC mode f_OC1A = f_clk / (2 N (1 + OCR1A))
    // holds down to OCR1A = 0; fast PWM's "minimum resolution allowed is 2-bit (ICR1 set to 0x0003)"
    // is 4 counts. The timer's range spans both: 1 .. 65536.
    expect([timer("atmega328p", "TIMER1").minCounts, timer("atmega328p", "TIMER1").maxCounts]).toEqual([
      1, 65536,
    ]);
  });
  it("8-bit AVR timers: 1 .. 256 counts", () => {
    // ATmega328P Timer/Counter0 and 2, ATtiny85 Timer/Counter0 and 1: 8-bit counters, OCRnx 0..255.
    for (const [id, name] of [
      ["atmega328p", "TIMER0"],
      ["atmega328p", "TIMER2"],
      ["attiny85", "TIMER0"],
      ["attiny85", "TIMER1"],
    ])
      expect([timer(id, name).minCounts, timer(id, name).maxCounts], `${id} ${name}`).toEqual([1, 256]);
  });
  it("STM32G031 TIM2 and TIM3: at least 2 counts (the counter is blocked while ARR = 0)", () => {
    // RM0444, general-purpose timers, upcounting mode: "the counter is blocked while the
    // auto-reload value is null", so ARR >= 1, a period of ARR + 1 >= 2 counts; TIM2 is 32-bit, TIM3 16-bit.
    expect([timer("stm32g031", "TIM2").minCounts, timer("stm32g031", "TIM2").maxCounts]).toEqual([
      2,
      2 ** 32,
    ]);
    expect([timer("stm32g031", "TIM3").minCounts, timer("stm32g031", "TIM3").maxCounts]).toEqual([2, 65536]);
  });
});

describe("toolchains", () => {
  it("both Cortex-M0+ parts build with arm-none-eabi-gcc for cortex-m0plus in Thumb", () => {
    // RP2040 datasheet 2.4: dual Cortex-M0+; STM32G031 reference manual RM0444: Arm Cortex-M0+.
    // The M0+ runs the Thumb instruction set only (Armv6-M architecture reference manual).
    for (const id of ["rp2040", "stm32g031"])
      expect(device(id).toolchain, id).toMatchObject({
        compiler: "arm-none-eabi-gcc",
        target: "-mcpu=cortex-m0plus -mthumb",
      });
  });
  it("the AVR parts build with avr-gcc for their own -mmcu", () => {
    for (const id of ["atmega328p", "attiny85"])
      expect(device(id).toolchain, id).toMatchObject({ compiler: "avr-gcc", target: `-mmcu=${id}` });
  });
});

describe("service pins of the default packages", () => {
  it("ATtiny85 PDIP-8: VCC 8, GND 4, RESET 1, ISP on 5/6/7", () => {
    // ATtiny25/45/85 datasheet, pin configuration (PDIP/SOIC): 1 PB5 (RESET), 2 PB3 (XTAL1),
    // 3 PB4 (XTAL2), 4 GND, 5 PB0 (MOSI), 6 PB1 (MISO), 7 PB2 (SCK), 8 VCC (from memory).
    expect(pinsOf("attiny85")).toMatchObject({
      VCC: [8],
      GND: [4],
      RESET: [1],
      XTAL1: [2],
      XTAL2: [3],
      MOSI: [5],
      MISO: [6],
      SCK: [7],
    });
  });
  it("ATmega328P PDIP-28: VCC 7, AVCC 20, AREF 21, GND 8 and 22, RESET 1, ISP on 17/18/19", () => {
    // ATmega328P datasheet, 28-pin PDIP pinout (from memory).
    expect(pinsOf("atmega328p")).toMatchObject({
      VCC: [7],
      AVCC: [20],
      AREF: [21],
      GND: [8, 22],
      RESET: [1],
      XTAL1: [9],
      XTAL2: [10],
      MOSI: [17],
      MISO: [18],
      SCK: [19],
    });
  });
  it("PIC12F1840 PDIP-8: VDD 1, VSS 8, MCLR 4, ICSPDAT 7, ICSPCLK 6", () => {
    // PIC12(L)F1840 datasheet DS40001441, 8-pin diagram: RA3/MCLR/VPP pin 4, RA0/ICSPDAT 7,
    // RA1/ICSPCLK 6, RA5/CLKIN 2, RA4/CLKOUT 3 (from memory).
    expect(pinsOf("pic12f1840")).toMatchObject({
      VDD: [1],
      VSS: [8],
      "MCLR/VPP": [4],
      ICSPDAT: [7],
      ICSPCLK: [6],
    });
  });
  it("MSP430G2553 PDIP-20: DVCC 1, DVSS 20, RST 16, TEST 17", () => {
    // MSP430G2x53 datasheet SLAS735, N20 package pinout: DVCC 1, DVSS 20, RST/NMI/SBWTDIO 16,
    // TEST/SBWTCK 17, XOUT/P2.7 18, XIN/P2.6 19 (from memory).
    expect(pinsOf("msp430g2553")).toMatchObject({
      DVCC: [1],
      DVSS: [20],
      "RST/NMI/SBWTDIO": [16],
      "TEST/SBWTCK": [17],
      XIN: [19],
      XOUT: [18],
    });
  });
  it("RP2040 QFN-56: ground is the exposed pad 57, RUN 26, crystal on 20/21, SWD on 24/25", () => {
    // RP2040 datasheet 1.4.2 pin locations: XIN 20, XOUT 21, SWCLK 24, SWD 25, RUN 26, GND the
    // central pad (57), IOVDD 1, 10, 22, 33, 42, 49, DVDD 23 and 50 (from memory).
    expect(pinsOf("rp2040")).toMatchObject({
      GND: [57],
      RUN: [26],
      XIN: [20],
      XOUT: [21],
      SWCLK: [24],
      SWD: [25],
      IOVDD: [1, 10, 22, 33, 42, 49],
      DVDD: [23, 50],
    });
  });
});
