// Service pins of the two AVRs in their through-hole packages: supply,
// ground, reset, clock pins and the 6-pin ISP header. Pin numbers:
// ATmega328P datasheet (DS40002061), Pin Configurations, 28-pin PDIP;
// ATtiny25/45/85 datasheet (DS40001911), Pinout, 8-pin PDIP/SOIC. ISP header
// order (1 MISO, 2 VCC, 3 SCK, 4 MOSI, 5 RESET, 6 GND) and the reset pull-up:
// Microchip AN2519 "AVR Microcontroller Hardware Design Considerations".
import type { PackageInfo } from "../plan-types";

export const ATMEGA328P_PDIP28: PackageInfo = {
  name: "PDIP-28",
  servicePins: [
    { signal: "VCC", role: "supply", packagePins: [7], notes: "100 nF to GND at the pin" },
    {
      signal: "AVCC",
      role: "supply",
      packagePins: [20],
      notes: "tie to VCC (through 10 uH if the ADC is used); 100 nF to GND",
    },
    {
      signal: "AREF",
      role: "supply",
      packagePins: [21],
      notes: "100 nF to GND or leave open; never tie to VCC while the ADC uses the internal reference",
    },
    { signal: "GND", role: "ground", packagePins: [8, 22], notes: "both pins to ground" },
    {
      signal: "RESET",
      role: "reset",
      port: "PC6",
      packagePins: [1],
      notes: "10 kOhm pull-up to VCC; ISP header pin 5",
    },
    {
      signal: "XTAL1",
      role: "crystal",
      port: "PB6",
      packagePins: [9],
      notes: "crystal to XTAL2, 12-22 pF load capacitors to GND",
    },
    { signal: "XTAL2", role: "crystal", port: "PB7", packagePins: [10], notes: "crystal to XTAL1" },
    {
      signal: "CLKI",
      role: "clock-in",
      port: "PB6",
      packagePins: [9],
      notes: "external clock input (same pin as XTAL1)",
    },
    {
      signal: "MOSI",
      role: "programming",
      port: "PB3",
      packagePins: [17],
      notes: "ISP header pin 4; also OC2A: keep a load on it high-impedance while programming",
    },
    { signal: "MISO", role: "programming", port: "PB4", packagePins: [18], notes: "ISP header pin 1" },
    { signal: "SCK", role: "programming", port: "PB5", packagePins: [19], notes: "ISP header pin 3" },
  ],
};

export const ATTINY85_PDIP8: PackageInfo = {
  name: "PDIP-8",
  servicePins: [
    { signal: "VCC", role: "supply", packagePins: [8], notes: "100 nF to GND at the pin; ISP header pin 2" },
    { signal: "GND", role: "ground", packagePins: [4], notes: "ISP header pin 6" },
    {
      signal: "RESET",
      role: "reset",
      port: "PB5",
      packagePins: [1],
      notes: "10 kOhm pull-up to VCC; ISP header pin 5",
    },
    {
      signal: "XTAL1",
      role: "crystal",
      port: "PB3",
      packagePins: [2],
      notes: "crystal to XTAL2, 12-22 pF load capacitors to GND",
    },
    { signal: "XTAL2", role: "crystal", port: "PB4", packagePins: [3], notes: "crystal to XTAL1" },
    {
      signal: "CLKI",
      role: "clock-in",
      port: "PB3",
      packagePins: [2],
      notes: "external clock input (same pin as XTAL1)",
    },
    {
      signal: "MOSI",
      role: "programming",
      port: "PB0",
      packagePins: [5],
      notes:
        "ISP header pin 4; also OC0A: the programmer drives it, so keep the load high-impedance while programming",
    },
    {
      signal: "MISO",
      role: "programming",
      port: "PB1",
      packagePins: [6],
      notes:
        "ISP header pin 1; also OC0B/OC1A: the programmer reads it, so keep the load high-impedance while programming",
    },
    { signal: "SCK", role: "programming", port: "PB2", packagePins: [7], notes: "ISP header pin 3" },
  ],
};
