// Builds an MSP430 bundle folder with its own Makefile (firmware.md build
// contract: `make -C <folder>` -> build/firmware.elf and build/firmware.hex,
// Debian clang + lld + llvm against the msp430mcu headers), optionally after
// editing one source file to plant a fault.
import { readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import type { BundleFile } from "@/lib/bundle";
import { writeFolder } from "./files";
import { requireTool, run, type RunResult } from "./require-tool";

export interface Msp430Build {
  dir: string;
  elf: string;
  hex: string;
  make: RunResult;
}

/** One planted fault: replace `from` by `to` in `file`; the text must be there. */
export interface Plant {
  file: string;
  from: string | RegExp;
  to: string;
}

export function buildMsp430(files: BundleFile[], folder: string, plant?: Plant): Msp430Build {
  requireTool("clang", "clang");
  requireTool("ld.lld", "lld");
  requireTool("llvm-objcopy", "llvm");
  requireTool("make", "make");
  const dir = writeFolder(files, folder);
  if (plant) {
    const p = path.join(dir, plant.file);
    const text = readFileSync(p, "utf8");
    const next = text.replace(plant.from, plant.to);
    if (next === text) throw new Error(`planted fault: ${String(plant.from)} not found in ${plant.file}`);
    writeFileSync(p, next);
  }
  const make = run("make", ["-s", "-C", dir], dir, 120_000);
  return { dir, elf: path.join(dir, "build/firmware.elf"), hex: path.join(dir, "build/firmware.hex"), make };
}

/** Address of a symbol in the ELF (llvm-nm, Debian llvm). */
export function symbolAddress(elf: string, name: string): number {
  const r = run("llvm-nm", [elf], path.dirname(elf));
  const m = new RegExp(`^([0-9a-f]+) \\w ${name}$`, "m").exec(r.stdout);
  if (!m) throw new Error(`${name} is not in ${elf}`);
  return Number.parseInt(m[1], 16);
}
