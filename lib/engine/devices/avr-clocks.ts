// Clock options shared by the ATmega328P and the ATtiny85: an external
// crystal and the internal 8 MHz RC oscillator, factory or user calibrated
// (calibration accuracy: ATmega328P and ATtiny25/45/85 datasheets, from memory);
// then the 128 kHz oscillator and an external clock, listed last.
import type { ClockOption } from "../plan-types";

export const AVR_COMMON_CLOCKS: ClockOption[] = [
  {
    id: "crystal",
    label: "Crystal 1-20 MHz",
    minHz: 1e6,
    maxHz: 20e6,
    accuracyPpm: 50,
    kind: "crystal",
    accuracySource: "common practice",
  },
  {
    id: "rc8m",
    label: "Internal RC 8 MHz, factory calibrated",
    hz: 8e6,
    accuracyPpm: 100000,
    kind: "internal",
    accuracySource: "datasheet, from memory",
  },
  {
    id: "rc8m-cal",
    label: "Internal RC 8 MHz, user calibrated",
    hz: 8e6,
    accuracyPpm: 10000,
    kind: "internal",
    accuracySource: "datasheet, from memory",
  },
];

export const AVR_SLOW_AND_EXTERNAL_CLOCKS: ClockOption[] = [
  {
    id: "rc128k",
    label: "Internal 128 kHz oscillator",
    hz: 128e3,
    accuracyPpm: 100000,
    kind: "internal",
    accuracySource: "from memory",
  },
  {
    id: "external",
    label: "External clock 0-20 MHz",
    minHz: 1e3,
    maxHz: 20e6,
    accuracyPpm: 50,
    kind: "external",
    accuracySource: "common practice",
  },
];
