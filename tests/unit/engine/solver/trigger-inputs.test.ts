// Input-to-timer latency counts of the triggered plans (lib/engine/solver/trigger-inputs.ts),
// worked out here from the datasheets' interrupt response rules.
import { describe, expect, it } from "vitest";
import { TRIGGER_INPUTS } from "@/lib/engine/solver/trigger-inputs";

describe("triggered plans: interrupt response of the input", () => {
  it("AVR response = 4 cycles to the vector + the vector's jump + 2 to finish the busy loop's rjmp", () => {
    // ATmega328P datasheet 7.7.1 / ATtiny85 datasheet 4.7.1 "Interrupt Response Time": four
    // clock cycles minimum before the vector runs. The vector itself: ATmega328P has 2-word
    // vectors holding a JMP (3 cycles), ATtiny85 1-word vectors holding an RJMP (2 cycles)
    // (AVR Instruction Set Manual cycle counts); the busy loop's RJMP takes 2 cycles.
    const RJMP = 2;
    const JMP = 3;
    expect(TRIGGER_INPUTS.atmega328p.responseCycles).toBe(4 + JMP + RJMP);
    expect(TRIGGER_INPUTS.attiny85.responseCycles).toBe(4 + RJMP + RJMP);
  });

  it("pins not checked against a datasheet say so", () => {
    // The STM32G031 TSSOP-20 PA1 pin number and the RP2040 QFN-56 GPIO15 pin number are
    // recalled, not checked (the source comments say "from memory"): the pin map must mark them.
    expect(TRIGGER_INPUTS.stm32g031.input.fromMemory).toBe(true);
    expect(TRIGGER_INPUTS.rp2040.input.fromMemory).toBe(true);
  });
});

describe("triggered plans: the input pin in the datasheets' pin names", () => {
  // Typed here from each datasheet's pinout, not read from the device files. The generated
  // code addresses the port by portName and bit (PORTD/PIND bit 2, GPIOA bit 1, P1IN bit 3 ...),
  // the pin map prints port and package pin: all three must name the same pin.
  // ATmega328P DS40002061 PDIP-28: PD2/INT0 = pin 4. ATtiny25/45/85 DS40001911 PDIP-8:
  // PB2/INT0 = pin 7. PIC12F1840 DS40001441 PDIP-8: RA1 = pin 6. MSP430G2553 SLAS735 PDIP-20:
  // P1.3 = pin 5. STM32G031 TSSOP-20 PA1 = pin 8 and RP2040 QFN-56 GPIO15 = pin 18: from memory.
  const expected = {
    atmega328p: { port: "PD2", portName: "D", bit: 2, packagePin: 4, package: "PDIP-28" },
    attiny85: { port: "PB2", portName: "B", bit: 2, packagePin: 7, package: "PDIP-8" },
    pic12f1840: { port: "RA1", portName: "A", bit: 1, packagePin: 6, package: "PDIP-8" },
    msp430g2553: { port: "P1.3", portName: "1", bit: 3, packagePin: 5, package: "PDIP-20" },
    stm32g031: { port: "PA1", portName: "A", bit: 1, packagePin: 8, package: "TSSOP-20" },
    rp2040: { port: "GPIO15", portName: "GPIO", bit: 15, packagePin: 18, package: "QFN-56" },
  };
  for (const [device, want] of Object.entries(expected))
    it(device, () => {
      const got = TRIGGER_INPUTS[device as keyof typeof TRIGGER_INPUTS].input;
      expect({
        port: got.port,
        portName: got.portName,
        bit: got.bit,
        packagePin: got.packagePin,
        package: got.package,
      }).toEqual(want);
    });
});

describe("triggered plans: the edge setting in the datasheets' register words", () => {
  // Typed here from each document's edge-select description, not read from the device files;
  // the plan carries the text into the generated code's comments, the pin map and the checklist.
  // ATmega328P DS40002061, EICRA, "Interrupt 0 Sense Control": ISC01:ISC00 = 01 any logical
  // change, 10 falling edge, 11 rising edge. ATtiny25/45/85 DS40001911, MCUCR, the same ISC01:0
  // table. RM0444 (STM32G0x1), EXTI_RTSR1 / EXTI_FTSR1: bit n enables the rising / falling
  // trigger of line n (PA1 is line 1); both set, both edges. RP2040 datasheet, IO_BANK0
  // PROC0_INTE0..3: per GPIO EDGE_HIGH (rising) and EDGE_LOW (falling) enable bits.
  // PIC12F1840 DS40001441, interrupt-on-change: IOCAPx enables the positive edge, IOCANx the
  // negative edge of pin x (RA1). MSP430x2xx family user's guide SLAU144, PxIES: bit = 0 flags a
  // low-to-high transition, 1 a high-to-low one; one edge at a time, so both edges means
  // flipping the bit after each.
  const expected = {
    atmega328p: {
      rising: /^EICRA ISC01:0 = 11$/,
      falling: /^EICRA ISC01:0 = 10$/,
      both: /^EICRA ISC01:0 = 01\b/,
    },
    attiny85: {
      rising: /^MCUCR ISC01:0 = 11$/,
      falling: /^MCUCR ISC01:0 = 10$/,
      both: /^MCUCR ISC01:0 = 01\b/,
    },
    stm32g031: {
      rising: /^EXTI_RTSR1 bit 1$/,
      falling: /^EXTI_FTSR1 bit 1$/,
      both: /^EXTI_RTSR1 and EXTI_FTSR1 bit 1$/,
    },
    rp2040: {
      rising: /^PROC0_INTE EDGE_HIGH$/,
      falling: /^PROC0_INTE EDGE_LOW$/,
      both: /^PROC0_INTE EDGE_HIGH and EDGE_LOW$/,
    },
    pic12f1840: { rising: /^IOCAP1 = 1$/, falling: /^IOCAN1 = 1$/, both: /^IOCAP1 = 1 and IOCAN1 = 1$/ },
    msp430g2553: {
      rising: /^P1IES bit 3 = 0$/,
      falling: /^P1IES bit 3 = 1$/,
      both: /^P1IES bit 3 flipped\b/,
    },
  };
  for (const [device, want] of Object.entries(expected))
    it(device, () => {
      const got = TRIGGER_INPUTS[device as keyof typeof TRIGGER_INPUTS].edgeHow;
      expect(Object.keys(got).sort()).toEqual(["both", "falling", "rising"]);
      for (const edge of ["rising", "falling", "both"] as const) expect(got[edge], edge).toMatch(want[edge]);
    });
});
