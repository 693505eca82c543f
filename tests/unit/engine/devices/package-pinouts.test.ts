// Every timer output pin in every mode and the service pins of the four non-AVR parts, against
// pinouts typed here from the documents (not read from the device files). The pin map prints
// port, function and package pin; the generated code addresses the port by portName and bit
// (PORTB bit 1, GPIOA bit 0, P1OUT bit 2 ...): all of them must name the same pin.
// (The AVRs' service pins: avr-service-pins.test.ts.)
import { describe, expect, it } from "vitest";
import { DEVICES } from "@/lib/engine/devices";

type Out = [port: string, fn: string, packagePin: number, portName: string, bit: number];

// ATmega328P DS40002061, pin configurations (28-pin PDIP) and alternate port functions:
// PB1 = OC1A pin 15, PD6 = OC0A pin 12, PD5 = OC0B pin 11, PB3 = OC2A pin 17, PD3 = OC2B pin 5.
// ATtiny25/45/85 DS40001911, pinout (8-pin PDIP): PB0 = OC0A pin 5, PB1 = OC0B and OC1A pin 6.
// STM32G031 DS12992, TSSOP-20 pinout and alternate function table: PA0 = TIM2_CH1 (AF2) pin 7,
// PA6 = TIM3_CH1 (AF1) pin 13. RP2040 datasheet, GPIO function table (slice = GPIO / 2, channel A
// on even GPIOs, FUNCSEL 4 = PWM) and pin locations (QFN-56: GPIO0..7 on pins 2..9, GPIO8..15 on
// 11..18). PIC12F1840 DS40001441, 8-pin diagram: RA2 = CCP1 pin 5. MSP430G2553 SLAS735, 20-pin N
// package: P1.2 = TA0.1 pin 4. An interrupt-driven output is the same pin as plain GPIO.
const TIMER_PINS: Record<string, Record<string, Partial<Record<"pwm" | "toggle" | "isr", Out>>>> = {
  atmega328p: {
    TIMER1: {
      pwm: ["PB1", "OC1A", 15, "B", 1],
      toggle: ["PB1", "OC1A", 15, "B", 1],
      isr: ["PB1", "GPIO", 15, "B", 1],
    },
    TIMER0: {
      pwm: ["PD5", "OC0B", 11, "D", 5],
      toggle: ["PD6", "OC0A", 12, "D", 6],
      isr: ["PD6", "GPIO", 12, "D", 6],
    },
    TIMER2: {
      pwm: ["PD3", "OC2B", 5, "D", 3],
      toggle: ["PB3", "OC2A", 17, "B", 3],
      isr: ["PB3", "GPIO", 17, "B", 3],
    },
  },
  attiny85: {
    TIMER0: {
      pwm: ["PB1", "OC0B", 6, "B", 1],
      toggle: ["PB0", "OC0A", 5, "B", 0],
      isr: ["PB0", "GPIO", 5, "B", 0],
    },
    TIMER1: {
      pwm: ["PB1", "OC1A", 6, "B", 1],
      toggle: ["PB1", "OC1A", 6, "B", 1],
      isr: ["PB1", "GPIO", 6, "B", 1],
    },
  },
  stm32g031: {
    TIM2: {
      pwm: ["PA0", "TIM2_CH1", 7, "A", 0],
      toggle: ["PA0", "TIM2_CH1", 7, "A", 0],
      isr: ["PA0", "GPIO", 7, "A", 0],
    },
    TIM3: {
      pwm: ["PA6", "TIM3_CH1", 13, "A", 6],
      toggle: ["PA6", "TIM3_CH1", 13, "A", 6],
      isr: ["PA6", "GPIO", 13, "A", 6],
    },
  },
  rp2040: Object.fromEntries(
    Array.from({ length: 8 }, (_, slice) => {
      const gpio = 2 * slice;
      const pinNo = gpio < 8 ? gpio + 2 : gpio + 3;
      return [
        `PWM${slice}`,
        {
          pwm: [`GPIO${gpio}`, `PWM${slice}_A`, pinNo, "GPIO", gpio] as Out,
          isr: [`GPIO${gpio}`, "GPIO", pinNo, "GPIO", gpio] as Out,
        },
      ];
    }),
  ),
  pic12f1840: { TIMER2: { pwm: ["RA2", "CCP1", 5, "A", 2], isr: ["RA2", "GPIO", 5, "A", 2] } },
  msp430g2553: {
    TIMER0_A3: {
      pwm: ["P1.2", "TA0.1", 4, "1", 2],
      toggle: ["P1.2", "TA0.1", 4, "1", 2],
      isr: ["P1.2", "GPIO", 4, "1", 2],
    },
  },
};

const PACKAGE: Record<string, string> = {
  atmega328p: "PDIP-28",
  attiny85: "PDIP-8",
  stm32g031: "TSSOP-20",
  rp2040: "QFN-56",
  pic12f1840: "PDIP-8",
  msp430g2553: "PDIP-20",
};

describe("timer output pins in every mode", () => {
  for (const d of DEVICES)
    it(`${d.id}: every timer's pins, on its ${PACKAGE[d.id]}`, () => {
      const want = TIMER_PINS[d.id];
      expect(d.timers.map((t) => t.name).sort()).toEqual(Object.keys(want).sort());
      for (const t of d.timers) {
        const got = Object.fromEntries(
          Object.entries(t.pins).map(([mode, p]) => [
            mode,
            [p!.port, p!.function, p!.packagePin, p!.portName, p!.bit],
          ]),
        );
        expect(got, `${d.id} ${t.name}`).toEqual(want[t.name]);
        for (const p of Object.values(t.pins)) expect(p!.package, `${d.id} ${t.name}`).toBe(PACKAGE[d.id]);
      }
    });
});

type Svc = Record<string, { port?: string; pins: number[] }>;

// STM32G031 DS12992, TSSOP-20 pinout: 2 PC14-OSC32_IN (OSC_IN), 4 VDD/VDDA, 5 VSS/VSSA, 6 PF2-NRST,
// 9 PA2, 10 PA3 (USART2_TX/RX, used by the system bootloader: AN2606), 18 PA13 (SWDIO),
// 19 PA14-BOOT0 (SWCLK).
const STM32G031_TSSOP20: Svc = {
  "VDD/VDDA": { pins: [4] },
  "VSS/VSSA": { pins: [5] },
  NRST: { port: "PF2", pins: [6] },
  SWDIO: { port: "PA13", pins: [18] },
  SWCLK: { port: "PA14-BOOT0", pins: [19] },
  OSC_IN: { port: "PC14", pins: [2] },
  USART2_TX: { port: "PA2", pins: [9] },
  USART2_RX: { port: "PA3", pins: [10] },
};

// RP2040 datasheet, pin locations (QFN-56; pin 57 is the exposed ground pad); the supply, QSPI
// and ground pin numbers also checked against the pin numbers of a public KiCad RP2040 symbol
// (IOVDD 49, DVDD 50, QSPI_SD3 51, SCLK 52, SD0 53, SD2 54, SD1 55, SS 56, GND 57, VREG_VIN 44,
// VREG_VOUT 45).
const RP2040_QFN56: Svc = {
  IOVDD: { pins: [1, 10, 22, 33, 42, 49] },
  DVDD: { pins: [23, 50] },
  VREG_VIN: { pins: [44] },
  VREG_VOUT: { pins: [45] },
  USB_VDD: { pins: [48] },
  ADC_AVDD: { pins: [43] },
  GND: { pins: [57] },
  RUN: { pins: [26] },
  XIN: { pins: [20] },
  XOUT: { pins: [21] },
  SWCLK: { pins: [24] },
  SWD: { pins: [25] },
  QSPI_SS: { pins: [56] },
  QSPI_SCLK: { pins: [52] },
  "QSPI_SD0..SD3": { pins: [53, 55, 54, 51] },
  TESTEN: { pins: [19] },
};

// PIC12F1840 DS40001441, 8-pin PDIP diagram: 1 VDD, 2 RA5/CLKIN/OSC1, 3 RA4/CLKOUT/OSC2,
// 4 RA3/MCLR/VPP, 6 RA1/ICSPCLK, 7 RA0/ICSPDAT, 8 VSS.
const PIC12F1840_PDIP8: Svc = {
  VDD: { pins: [1] },
  VSS: { pins: [8] },
  "MCLR/VPP": { port: "RA3", pins: [4] },
  ICSPDAT: { port: "RA0", pins: [7] },
  ICSPCLK: { port: "RA1", pins: [6] },
  "OSC1/CLKIN": { port: "RA5", pins: [2] },
  "OSC2/CLKOUT": { port: "RA4", pins: [3] },
};

// MSP430G2553 SLAS735, 20-pin N package: 1 DVCC, 16 RST/NMI/SBWTDIO, 17 TEST/SBWTCK,
// 18 XOUT/P2.7, 19 XIN/P2.6, 20 DVSS.
const MSP430G2553_PDIP20: Svc = {
  DVCC: { pins: [1] },
  DVSS: { pins: [20] },
  "RST/NMI/SBWTDIO": { pins: [16] },
  "TEST/SBWTCK": { pins: [17] },
  XIN: { port: "P2.6", pins: [19] },
  XOUT: { port: "P2.7", pins: [18] },
};

describe("service pins of the four non-AVR parts match their pinouts", () => {
  const cases = [
    { device: "stm32g031", table: STM32G031_TSSOP20 },
    { device: "rp2040", table: RP2040_QFN56 },
    { device: "pic12f1840", table: PIC12F1840_PDIP8 },
    { device: "msp430g2553", table: MSP430G2553_PDIP20 },
  ];
  for (const { device, table } of cases)
    it(`${device} ${PACKAGE[device]}`, () => {
      const d = DEVICES.find((x) => x.id === device)!;
      expect(d.packages!.map((p) => p.name)).toEqual([PACKAGE[device]]);
      const seen = Object.fromEntries(
        d.packages![0].servicePins.map((s) => [
          s.signal,
          { ...(s.port !== undefined ? { port: s.port } : {}), pins: s.packagePins },
        ]),
      );
      expect(seen).toEqual(table);
    });
});
