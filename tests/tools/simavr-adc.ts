// Builds an AVR C source with avr-gcc and runs it in libsimavr through
// lib/firmware/emulate/harness/simavr/pin-trace.c with a chosen voltage on one ADC input,
// then returns the edges of one pin (VCD, IEEE 1364-2005 section 18).
import { createHash } from "node:crypto";
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { mustRun, requireTool } from "./require-tool";
import { simavrHarness } from "./simavr";
import { parseVcd, type Edge } from "@/lib/firmware/emulate/harness/vcd";

/** avr-gcc -Os the one C file into an Intel HEX image; returns its path. */
export function buildAvrHex(source: string, mcu: string, clockHz: number): string {
  requireTool("avr-gcc", "gcc-avr");
  const dir = path.join(
    tmpdir(),
    `cg-avr-adc-${process.pid}-${createHash("sha256").update(source).digest("hex").slice(0, 12)}`,
  );
  mkdirSync(dir, { recursive: true });
  writeFileSync(path.join(dir, "main.c"), source);
  mustRun(
    "avr-gcc",
    [`-mmcu=${mcu}`, `-DF_CPU=${clockHz}UL`, "-Os", "-Wall", "-Werror", "-o", "main.elf", "main.c"],
    dir,
  );
  mustRun("avr-objcopy", ["-O", "ihex", "-R", ".eeprom", "main.elf", "main.hex"], dir);
  return path.join(dir, "main.hex");
}

export interface AdcRun {
  hex: string;
  mcu: string;
  clockHz: number;
  port: string;
  bit: number;
  cycles: number;
  channel: number;
  millivolts: number;
  avccMillivolts: number;
}

export function runAvrWithAdc(r: AdcRun): Edge[] {
  const bin = simavrHarness("pin-trace");
  const dir = path.dirname(r.hex);
  const vcd = `pin-${r.channel}-${r.millivolts}.vcd`;
  mustRun(
    bin,
    [
      r.mcu,
      String(r.clockHz),
      r.hex,
      r.port,
      String(r.bit),
      String(Math.ceil(r.cycles)),
      vcd,
      String(r.channel),
      String(r.millivolts),
      String(r.avccMillivolts),
    ],
    dir,
    120_000,
  );
  return parseVcd(readFileSync(path.join(dir, vcd), "utf8"), `P${r.port}${r.bit}`);
}
