// Device names and RP2040 package pins a fresh mutation sample (seed 67)
// showed no test holding: the PIC12F1840's name (shown in every refusal that
// names the part) and the QFN-56 pin of GPIO8 and above.
import { describe, expect, it } from "vitest";
import { listDevices, planTarget } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

describe("each device carries the part name its datasheet uses", () => {
  // Part numbers as printed on each datasheet's title page: ATmega328P and
  // ATtiny85 (Microchip/Atmel), STM32G031 (ST DS12992), RP2040 (Raspberry Pi
  // Ltd), PIC12F1840 (Microchip DS40001441), MSP430G2553 (TI SLAS735).
  it("names all six", () => {
    expect(Object.fromEntries(listDevices().map((d) => [d.id, d.name]))).toEqual({
      atmega328p: "ATmega328P",
      attiny85: "ATtiny85",
      stm32g031: "STM32G031",
      rp2040: "RP2040",
      pic12f1840: "PIC12F1840",
      msp430g2553: "MSP430G2553",
    });
  });

  it("a refusal names the part", () => {
    // lib/engine/solver/validate.ts, checkPackage: the refusal names the part
    // and its packages (the PIC12F1840 is planned on its 8-pin PDIP).
    const err = expectEngineError(
      () =>
        planTarget({ device: "pic12f1840", clockHz: 8e6, periodS: 1e-3, highS: 5e-4, package: "SOIC-99" }),
      "invalid-request",
      "package",
    );
    expect(err.message).toBe('PIC12F1840 has no package "SOIC-99". Packages: PDIP-8.');
  });
});

describe("RP2040 QFN-56 pins of the PWM outputs", () => {
  // RP2040 datasheet, pin locations (QFN-56): GPIO0..7 on pins 2..9, IOVDD on
  // pin 10, GPIO8..15 on pins 11..18. Channel A of slice n is GPIO 2n.
  const cases: [slice: number, gpio: number, pin: number][] = [
    [3, 6, 8],
    [4, 8, 11],
    [7, 14, 17],
  ];
  for (const [slice, gpio, pin] of cases)
    it(`PWM${slice}_A on GPIO${gpio} is package pin ${pin}`, () => {
      const p = planTarget({
        device: "rp2040",
        clockHz: 125e6,
        periodS: 1e-3,
        highS: 5e-4,
        timer: `PWM${slice}`,
      });
      expect(p.pin).toMatchObject({
        port: `GPIO${gpio}`,
        function: `PWM${slice}_A`,
        packagePin: pin,
        package: "QFN-56",
      });
    });
});
