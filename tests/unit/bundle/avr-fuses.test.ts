// AVR fuse bytes for each clock option the AVR forms offer.
// Field values: ATmega328P datasheet (DS40002061), tables "Device Clocking
// Options Select", "Low Power Crystal Oscillator Operating Modes", "Full Swing
// Crystal Oscillator operating modes", "Start-up Times for the Low Power
// Crystal Oscillator Clock Selection" and "Fuse Low Byte"; ATtiny25/45/85
// datasheet (DS40001911), tables "Device Clocking Options Select", "Crystal
// Oscillator Operating Modes" and "Fuse Low Byte". Bit positions and factory
// bytes cross-checked against avr-libc's own part headers (Debian avr-libc:
// /usr/lib/avr/include/avr/iom328p.h, iotn85.h: FUSE_* masks, *FUSE_DEFAULT).
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { avrFuses } from "@/lib/bundle/avr-fuses";
import { listDevices } from "@/lib/engine";

/** Evaluates avr-libc's FUSE_x masks and LFUSE/HFUSE/EFUSE_DEFAULT from a part header. */
function libcFuses(header: string) {
  const text = readFileSync(`/usr/lib/avr/include/avr/${header}`, "utf8");
  const mask = new Map<string, number>();
  for (const m of text.matchAll(/#define\s+(FUSE_\w+)\s+\(unsigned char\)~_BV\((\d)\)/g))
    mask.set(m[1], 0xff & ~(1 << Number(m[2])));
  const def = (name: string): number => {
    const m = new RegExp(`#define\\s+${name}\\s+\\(([^)]*)\\)`).exec(text);
    if (!m) throw new Error(`${header} has no ${name}`);
    if (/^0x/i.test(m[1].trim())) return Number(m[1].trim());
    return m[1].split("&").reduce((acc, n) => acc & mask.get(n.trim())!, 0xff);
  };
  const bit = (name: string) => 7 - Math.clz32(~mask.get(name)! & 0xff) + 24; // position of the cleared bit
  return { mask, bit, low: def("LFUSE_DEFAULT"), high: def("HFUSE_DEFAULT"), ext: def("EFUSE_DEFAULT") };
}

const cksel = (low: number) => low & 0x0f;
const sut = (low: number) => (low >> 4) & 0x03;
const ckdiv8Unprogrammed = (low: number) => (low & 0x80) !== 0;

describe("AVR fuses against the datasheet tables and avr-libc's headers", () => {
  for (const [device, header] of [
    ["atmega328p", "iom328p.h"],
    ["attiny85", "iotn85.h"],
  ] as const) {
    const libc = libcFuses(header);

    it(`${device}: low-byte bit positions are avr-libc's (CKSEL3:0 0..3, SUT1:0 4..5, CKOUT 6, CKDIV8 7)`, () => {
      expect(
        ["CKSEL0", "CKSEL1", "CKSEL2", "CKSEL3", "SUT0", "SUT1", "CKOUT", "CKDIV8"].map((n) =>
          libc.bit(`FUSE_${n}`),
        ),
      ).toEqual([0, 1, 2, 3, 4, 5, 6, 7]);
    });

    it(`${device}: internal 8 MHz RC = the factory low byte with CKDIV8 unprogrammed`, () => {
      // factory: CKSEL = 0010, SUT = 10, CKDIV8 programmed (avr-libc LFUSE_DEFAULT = 0x62)
      expect(libc.low).toBe(0x62);
      const f = avrFuses(device, "rc8m", 8e6);
      expect(f.low).toBe(libc.low | 0x80);
      expect(f.high).toBe(libc.high);
      expect(f.extended).toBe(libc.ext);
    });

    it(`${device}: user-calibrated RC keeps EEPROM through chip erase (EESAVE programmed)`, () => {
      const f = avrFuses(device, "rc8m-cal", 8e6);
      expect(f.high).toBe(libc.high & libc.mask.get("FUSE_EESAVE")!);
      expect(f.low).toBe(0xe2);
    });

    it(`${device}: crystal ranges select CKSEL3:1 per the crystal oscillator table, CKSEL0 = 1, SUT = 11`, () => {
      // 0.9-3.0 MHz -> 101, 3.0-8.0 -> 110, 8.0-16 -> 111
      expect(cksel(avrFuses(device, "crystal", 2e6).low)).toBe(0b1011);
      expect(cksel(avrFuses(device, "crystal", 4e6).low)).toBe(0b1101);
      expect(cksel(avrFuses(device, "crystal", 16e6).low)).toBe(0b1111);
      // 3.0 and 8.0 MHz end one row and start the next; the bundle takes the lower row (its own choice)
      expect(cksel(avrFuses(device, "crystal", 3e6).low)).toBe(0b1011);
      expect(cksel(avrFuses(device, "crystal", 8e6).low)).toBe(0b1101);
      for (const hz of [1e6, 4e6, 16e6, 20e6]) {
        const low = avrFuses(device, "crystal", hz).low;
        expect(sut(low)).toBe(0b11);
        expect(ckdiv8Unprogrammed(low)).toBe(true);
      }
    });

    it(`${device}: external clock CKSEL = 0000`, () => {
      expect(cksel(avrFuses(device, "external", 1e6).low)).toBe(0b0000);
      expect(avrFuses(device, "external", 1e6).low).toBe(0xe0);
    });

    it(`${device}: every clock option the form offers has a fuse setting (min, max and fixed frequency)`, () => {
      const d = listDevices().find((x) => x.id === device)!;
      for (const c of d.clocks) {
        for (const hz of [c.hz, c.minHz, c.maxHz].filter((v): v is number => v !== undefined)) {
          expect(() => avrFuses(device, c.id, Math.max(hz, 1e6)), `${c.id} at ${hz}`).not.toThrow();
        }
      }
    });
  }

  it("ATmega328P above 16 MHz: the full swing crystal oscillator (CKSEL3:1 = 011)", () => {
    expect(cksel(avrFuses("atmega328p", "crystal", 20e6).low)).toBe(0b0111);
    // 16 MHz crystal, slowly rising power: 0xFF (same byte as common 16 MHz boards ship with; common practice)
    expect(avrFuses("atmega328p", "crystal", 16e6).low).toBe(0xff);
  });

  it("ATtiny85 8-20 MHz crystal stays in CKSEL3:1 = 111 (its table has no full swing mode)", () => {
    expect(cksel(avrFuses("attiny85", "crystal", 20e6).low)).toBe(0b1111);
  });

  it("the fuse explanation names each part's own 111 crystal row: ATtiny85 8.0-20 MHz, ATmega328P 8.0-16 MHz", () => {
    // ATtiny25/45/85 datasheet, Crystal Oscillator Operating Modes: CKSEL3:1 = 111 from 8.0 MHz, the part
    // runs to 20 MHz; ATmega328P datasheet, Low Power Crystal Oscillator Operating Modes: 111 is 8.0-16 MHz
    // (both from memory, as avr-fuses.ts states them)
    expect(avrFuses("attiny85", "crystal", 20e6).why[0]).toBe(
      "crystal 20 MHz: 8.0-20 MHz (CKSEL3:1 = 111), CKSEL0 = 1, SUT1:0 = 11 (slowly rising power)",
    );
    expect(avrFuses("attiny85", "crystal", 12e6).why[0]).toContain(": 8.0-20 MHz (CKSEL3:1 = 111),");
    expect(avrFuses("atmega328p", "crystal", 12e6).why[0]).toContain(": 8.0-16 MHz (CKSEL3:1 = 111),");
  });

  it("128 kHz oscillator: ATmega328P CKSEL = 0011, ATtiny85 CKSEL = 0100", () => {
    expect(cksel(avrFuses("atmega328p", "rc128k", 128e3).low)).toBe(0b0011);
    expect(cksel(avrFuses("attiny85", "rc128k", 128e3).low)).toBe(0b0100);
  });

  it("ATtiny85 PLL clock CKSEL = 0001; the ATmega328P has none and is refused naming the field", () => {
    expect(cksel(avrFuses("attiny85", "pll16m", 16e6).low)).toBe(0b0001);
    expect(() => avrFuses("atmega328p", "pll16m", 16e6)).toThrow(/no PLL/);
    expect(() => avrFuses("atmega328p", "sundial", 16e6)).toThrow(
      expect.objectContaining({ field: "clockSource" }),
    );
  });
});
