// The two AVRs' service pins against their datasheet pinouts, typed here
// from the datasheets (not read from the device files): the pin map prints
// each signal's port name and package pin, and a technician solders by it.
import { describe, expect, it } from "vitest";
import { listDevices } from "@/lib/engine";

// ATmega328P datasheet (DS40002061), Pin Configurations, 28-pin PDIP:
// 1 PC6 (RESET), 7 VCC, 8 GND, 9 PB6 (XTAL1/TOSC1), 10 PB7 (XTAL2/TOSC2),
// 17 PB3 (MOSI/OC2A), 18 PB4 (MISO), 19 PB5 (SCK), 20 AVCC, 21 AREF, 22 GND.
const ATMEGA328P_PDIP28: Record<string, { port?: string; pins: number[] }> = {
  RESET: { port: "PC6", pins: [1] },
  VCC: { pins: [7] },
  GND: { pins: [8, 22] },
  XTAL1: { port: "PB6", pins: [9] },
  CLKI: { port: "PB6", pins: [9] },
  XTAL2: { port: "PB7", pins: [10] },
  MOSI: { port: "PB3", pins: [17] },
  MISO: { port: "PB4", pins: [18] },
  SCK: { port: "PB5", pins: [19] },
  AVCC: { pins: [20] },
  AREF: { pins: [21] },
};

// ATtiny25/45/85 datasheet (DS40001911), Pinout, 8-pin PDIP/SOIC:
// 1 PB5 (RESET/dW/ADC0), 2 PB3 (XTAL1/CLKI), 3 PB4 (XTAL2), 4 GND,
// 5 PB0 (MOSI/OC0A), 6 PB1 (MISO/OC0B/OC1A), 7 PB2 (SCK/INT0), 8 VCC.
const ATTINY85_PDIP8: Record<string, { port?: string; pins: number[] }> = {
  RESET: { port: "PB5", pins: [1] },
  XTAL1: { port: "PB3", pins: [2] },
  CLKI: { port: "PB3", pins: [2] },
  XTAL2: { port: "PB4", pins: [3] },
  GND: { pins: [4] },
  MOSI: { port: "PB0", pins: [5] },
  MISO: { port: "PB1", pins: [6] },
  SCK: { port: "PB2", pins: [7] },
  VCC: { pins: [8] },
};

const cases = [
  { device: "atmega328p", pkg: "PDIP-28", table: ATMEGA328P_PDIP28 },
  { device: "attiny85", pkg: "PDIP-8", table: ATTINY85_PDIP8 },
];

describe("AVR service pins match the datasheet pinout", () => {
  for (const { device, pkg, table } of cases)
    it(`${device} ${pkg}`, () => {
      const d = listDevices().find((x) => x.id === device)!;
      const p = d.packages!.find((x) => x.name === pkg)!;
      const seen = Object.fromEntries(
        p.servicePins.map((s) => [
          s.signal,
          { ...(s.port !== undefined ? { port: s.port } : {}), pins: s.packagePins },
        ]),
      );
      expect(seen).toEqual(table);
    });
});
