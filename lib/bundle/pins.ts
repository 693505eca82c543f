// Electrical facts of an output pin, per device, for the pin map. Values are
// the datasheets' absolute maximum / drive ratings as named beside each.
import type { PinFacts } from "./device-view";
import type { BundlePlan } from "./types";

interface DriveFacts {
  logic: string;
  drive: string;
}

const DRIVE: Record<string, DriveFacts> = {
  // ATmega328P / ATtiny85 datasheets, Absolute Maximum Ratings: 40 mA DC per I/O pin
  atmega328p: {
    logic: "CMOS push-pull, VOH ≈ VCC (5 V or 3.3 V supply)",
    drive: "40 mA absolute maximum per pin; keep under 20 mA",
  },
  attiny85: {
    logic: "CMOS push-pull, VOH ≈ VCC (5 V or 3.3 V supply)",
    drive: "40 mA absolute maximum per pin; keep under 20 mA",
  },
  // STM32G031 datasheet, Absolute Maximum Ratings (IIO per pin)
  stm32g031: { logic: "3.3 V CMOS push-pull", drive: "15 mA absolute maximum per pin" },
  // RP2040 datasheet, pads: programmable drive strength 2/4/8/12 mA, reset 4 mA
  rp2040: { logic: "3.3 V CMOS push-pull (IOVDD)", drive: "4 mA drive strength as configured (pad setting)" },
  // PIC12F1840 datasheet, Absolute Maximum Ratings (from memory)
  pic12f1840: { logic: "CMOS push-pull, VOH ≈ VDD (1.8..5.5 V)", drive: "25 mA maximum per pin" },
  // MSP430G2553 datasheet, recommended output current (from memory)
  msp430g2553: {
    logic: "CMOS push-pull, VOH ≈ DVCC (1.8..3.6 V)",
    drive: "6 mA per pin, 48 mA total for all outputs",
  },
};

export function pinFacts(plan: BundlePlan, signal = "TIMING_OUT"): PinFacts {
  const d = DRIVE[plan.device] ?? { logic: "see datasheet", drive: "see datasheet" };
  return {
    signal,
    port: plan.pin.port,
    function: plan.pin.function,
    packagePin: String(plan.pin.packagePin),
    package: plan.pin.package,
    direction: "output",
    logic: d.logic,
    drive: d.drive,
  };
}

/** Port letter and bit of an AVR/PIC-style port name such as "PB1" or "RA2". */
export function avrPin(plan: BundlePlan): PinFacts {
  const facts = pinFacts(plan);
  if (!/^P[A-D][0-7]$/.test(facts.port)) {
    throw new Error(`${plan.device}: unexpected port name ${facts.port}`);
  }
  return facts;
}
