// Build a generated AVR folder with avr-gcc and run it in simavr.
// Recipes: avr-gcc / avr-libc manuals; simavr's avr_mcu_section.h (package
// libsimavr-dev) for the trace section. The trace prologue is added only
// here: the bundle itself stays free of simulator code.
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { BundleFile } from "@/lib/bundle";
import { mustRun, requireTool } from "./require-tool";
import { writeFolder } from "./files";

export interface AvrBuild {
  dir: string;
  elf: string;
}

export function buildAvr(
  files: BundleFile[],
  folder: string,
  mcu: string,
  extraSources: string[] = [],
): AvrBuild {
  requireTool("avr-gcc", "gcc-avr avr-libc");
  const dir = writeFolder(files, folder);
  mustRun(
    "avr-gcc",
    [
      `-mmcu=${mcu}`,
      "-Os",
      "-std=c11",
      "-Wall",
      "-Wextra",
      "-Werror",
      "-I/usr/include/simavr/avr",
      "-Wl,--undefined=_mmcu,--section-start=.mmcu=0x910000",
      "-o",
      "out.elf",
      "src/main.c",
      ...extraSources,
    ],
    dir,
  );
  return { dir, elf: path.join(dir, "out.elf") };
}

/**
 * Trace prologue: names the MCU and clock for simavr, traces one port pin to
 * trace.vcd, and ends the run with the watchdog interrupt after `stopWdp`
 * (WDP3:0 code; 5 = 0.5 s, 4 = 0.25 s: ATmega328P / ATtiny85 datasheets,
 * watchdog timer prescale table). cli + sleep is simavr's "done" signal.
 */
export function tracePrologue(mcu: string, fCpu: number, port: string, bit: number, stopWdp: number): string {
  const wdtReg = mcu === "attiny85" ? "WDTCR" : "WDTCSR";
  const wdp =
    [
      stopWdp & 1 && "(1 << WDP0)",
      stopWdp & 2 && "(1 << WDP1)",
      stopWdp & 4 && "(1 << WDP2)",
      stopWdp & 8 && "(1 << WDP3)",
    ]
      .filter(Boolean)
      .join(" | ") || "0";
  return `#include <avr/io.h>
#include <avr/interrupt.h>
#include <avr/sleep.h>
#include "avr_mcu_section.h"
AVR_MCU(${fCpu}, "${mcu}");
AVR_MCU_VCD_FILE("trace.vcd", 1000);
AVR_MCU_VCD_PORT_PIN('${port}', ${bit}, "P${port}${bit}");

void sim_stop_arm(void) __attribute__((naked, used, section(".init8")));
void sim_stop_arm(void)
{
  MCUSR = 0;
  ${wdtReg} = (1 << WDCE) | (1 << WDE);
  ${wdtReg} = (1 << WDIE) | ${wdp};
}

ISR(WDT_vect)
{
  cli();
  sleep_enable();
  sleep_cpu();
}
`;
}

export function simulateAvr(build: AvrBuild): string {
  requireTool("simavr", "simavr");
  mustRun("simavr", ["out.elf"], build.dir, 60_000);
  return readFileSync(path.join(build.dir, "trace.vcd"), "utf8");
}

export function scratchDir(prefix: string): string {
  return mkdtempSync(path.join(tmpdir(), prefix));
}

export function writeText(dir: string, name: string, text: string): string {
  const p = path.join(dir, name);
  writeFileSync(p, text);
  return p;
}
