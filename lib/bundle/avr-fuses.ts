// AVR fuse bytes for the planned clock option. A fuse bit reads 0 when
// programmed. Sources: ATmega328P datasheet (Microchip DS40002061), "System
// Clock and Clock Options" (Device Clocking Options Select; Low Power Crystal
// Oscillator Operating Modes; Full Swing Crystal Oscillator Operating Modes;
// start-up time tables) and "Memory Programming" (Fuse Low Byte, Fuse High
// Byte, Extended Fuse Byte); ATtiny25/45/85 datasheet (DS40001911), "System
// Clock and Clock Options" (Device Clocking Options Select; Crystal Oscillator
// Operating Modes) and "Memory Programming" (Fuse Low/High/Extended Byte).
// Low byte on both: CKDIV8 7, CKOUT 6, SUT1:0 5..4, CKSEL3:0 3..0.
import { EngineError } from "@/lib/engine/errors";

export interface AvrFuses {
  low: number;
  high: number;
  extended: number;
  /** avrdude's part id (-p) */
  avrdudePart: string;
  /** one line per choice, in plain words */
  why: string[];
}

// CKDIV8 and CKOUT unprogrammed (1): full clock, no clock output pin.
const NO_DIV_NO_OUT = 0xc0;

/** Crystal: CKSEL3:1 by frequency range, CKSEL0 = 1 with SUT1:0 = 11 (crystal, slowly rising power: 16K CK start-up). */
function crystalLow(device: string, hz: number): { low: number; range: string } {
  const sut = 0x30;
  // Low power crystal oscillator ranges on both parts: 0.9-3.0 MHz 101, 3.0-8.0 110, 8.0-16 (tiny: 8.0-20) 111.
  if (hz < 0.9e6) throw new Error("below the crystal oscillator's 0.9 MHz range");
  if (hz <= 3e6) return { low: NO_DIV_NO_OUT | sut | 0b1011, range: "0.9-3.0 MHz (CKSEL3:1 = 101)" };
  if (hz <= 8e6) return { low: NO_DIV_NO_OUT | sut | 0b1101, range: "3.0-8.0 MHz (CKSEL3:1 = 110)" };
  if (device === "attiny85" || hz <= 16e6)
    return {
      low: NO_DIV_NO_OUT | sut | 0b1111,
      range: device === "attiny85" ? "8.0-20 MHz (CKSEL3:1 = 111)" : "8.0-16 MHz (CKSEL3:1 = 111)",
    };
  // ATmega328P above 16 MHz: the full swing crystal oscillator, 0.4-20 MHz (CKSEL3:1 = 011).
  return { low: NO_DIV_NO_OUT | sut | 0b0111, range: "full swing oscillator 0.4-20 MHz (CKSEL3:1 = 011)" };
}

/** Fuse bytes for an ATmega328P or ATtiny85 plan on the given clock option. */
export function avrFuses(device: string, clockSource: string, clockHz: number): AvrFuses {
  const tiny = device === "attiny85";
  if (!tiny && device !== "atmega328p")
    throw new EngineError("invalid-request", `${device} is not an AVR with fuse tables here`);
  // High byte defaults: ATmega328P 0xD9 (SPIEN programmed, BOOTSZ1:0 = 00, BOOTRST unprogrammed: no
  // boot loader); ATtiny85 0xDF (SPIEN programmed, BOD off). EESAVE (bit 3) is programmed for the
  // user-calibrated clock so a chip erase keeps the calibration byte in EEPROM.
  const highDefault = tiny ? 0xdf : 0xd9;
  // Extended byte: ATmega328P BODLEVEL2:0 = 111 (brown-out detection off); ATtiny85 SELFPRGEN unprogrammed.
  const extended = 0xff;
  const why: string[] = [];
  let low: number;
  const sut10 = 0x20; // SUT1:0 = 10: the datasheets' default start-up delay for RC and external clocks
  switch (clockSource) {
    case "crystal": {
      try {
        const c = crystalLow(device, clockHz);
        low = c.low;
        why.push(`crystal ${clockHz / 1e6} MHz: ${c.range}, CKSEL0 = 1, SUT1:0 = 11 (slowly rising power)`);
      } catch (e) {
        throw new EngineError(
          "invalid-request",
          `${device}: crystal ${clockHz} Hz is ${(e as Error).message}`,
        );
      }
      break;
    }
    case "rc8m":
    case "rc8m-cal":
      low = NO_DIV_NO_OUT | sut10 | 0b0010;
      why.push(
        "internal 8 MHz RC oscillator: CKSEL3:0 = 0010, CKDIV8 unprogrammed (factory setting divides by 8)",
      );
      break;
    case "rc128k":
      low = NO_DIV_NO_OUT | sut10 | (tiny ? 0b0100 : 0b0011);
      why.push(`internal 128 kHz oscillator: CKSEL3:0 = ${tiny ? "0100" : "0011"}, CKDIV8 unprogrammed`);
      break;
    case "external":
      low = NO_DIV_NO_OUT | sut10 | 0b0000;
      why.push("external clock on CLKI/XTAL1: CKSEL3:0 = 0000, CKDIV8 unprogrammed");
      break;
    case "pll16m":
      if (!tiny) throw new EngineError("invalid-request", `${device} has no PLL clock option`, "clockSource");
      low = NO_DIV_NO_OUT | sut10 | 0b0001;
      why.push("PLL clock 16 MHz from the 8 MHz RC oscillator: CKSEL3:0 = 0001, CKDIV8 unprogrammed");
      break;
    default:
      throw new EngineError(
        "invalid-request",
        `${device}: no fuse setting for clock option "${clockSource}"`,
        "clockSource",
      );
  }
  const high = clockSource === "rc8m-cal" ? highDefault & ~0x08 : highDefault;
  why.push(
    clockSource === "rc8m-cal"
      ? `high byte: factory value with EESAVE programmed (keeps the calibration byte at EEPROM 0)`
      : `high byte: factory value (serial programming on, reset pin kept as reset)`,
  );
  why.push(
    tiny
      ? "extended byte: factory value (self-programming off)"
      : "extended byte: factory value (brown-out detection off)",
  );
  return { low, high, extended, avrdudePart: tiny ? "t85" : "m328p", why };
}
