// The AVRs' user-calibrated internal RC option. ATmega328P datasheet
// (DS40002061) 8.12.1 OSCCAL and ATtiny25/45/85 datasheet (DS40001911) 6.5.1
// OSCCAL: writing the register tunes the 8 MHz RC; the factory value is loaded
// at reset, so a user calibration must be written by the firmware at start.
// The bundle keeps the chip's own value in EEPROM byte 0 (avr-libc
// eeprom_read_byte; 0xFF is an erased byte, AVR datasheets "EEPROM": erased =
// 0xFF); its README's flashing steps say how to store it, and the checklist
// has a bench line that it was stored. The factory-calibrated option has none
// of this.
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleTargetRequest } from "@/lib/bundle";
import { spec } from "./fixtures";

function files(device: "atmega328p" | "attiny85", clockSource: "rc8m" | "rc8m-cal") {
  const t: BundleTargetRequest = {
    device,
    clockHz: 8e6,
    periodS: 2e-3,
    highS: 0.5e-3,
    mode: "pwm",
    clockSource,
  };
  const all = buildBundleSources(spec([t], { mainsPowered: false, drivesThyristor: false }));
  const text = (path: string) => String(all.find((f) => f.path === path)!.content);
  return {
    main: text(`${device}/src/main.c`),
    makefile: text(`${device}/Makefile`),
    readme: text("README.md"),
    checklist: text(`${device}/CHECKLIST.md`),
  };
}

describe("AVR user-calibrated RC", () => {
  for (const device of ["atmega328p", "attiny85"] as const) {
    it(`${device}: the firmware loads OSCCAL from EEPROM byte 0 unless erased, and says how to store it`, () => {
      const f = files(device, "rc8m-cal");
      expect(f.main).toContain("#include <avr/eeprom.h>");
      expect(f.main).toContain("eeprom_read_byte((const uint8_t *)0)");
      expect(f.main).toMatch(/if \(cal != 0xFF\) \{\s*OSCCAL = cal;/);
      expect(f.makefile).toMatch(/^calibration:\n\t\$\(AVRDUDE\) -U eeprom:w:\$\(OSCCAL\):m$/m);
      expect(f.readme).toContain(
        "OSCCAL calibration value in EEPROM byte 0 (`make calibration OSCCAL=0x..`)",
      );
    });

    it(`${device}: the factory-calibrated RC leaves OSCCAL alone`, () => {
      const f = files(device, "rc8m");
      expect(f.main).not.toContain("OSCCAL");
      expect(f.main).not.toContain("avr/eeprom.h");
      expect(f.makefile).not.toMatch(/^calibration:/m);
      expect(f.readme).not.toContain("OSCCAL");
      expect(f.checklist).not.toContain("OSCCAL");
    });
  }
});
