// Build a generated STM32G031 folder with its own Makefile (firmware.md build
// contract: `make -C <folder>` into build/) for the tests, and run the ELF in
// the python3-unicorn harness, which lives with the product's emulator
// wrapper (lib/firmware/emulate/harness/stm32g031-emu.py, our own code;
// Debian python3-unicorn under /usr/bin/python3).
import { spawnSync } from "node:child_process";
import { readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import type { BundleFile } from "@/lib/bundle";
import {
  STM32_PYTHON,
  runStm32Sync,
  type RunOptions,
  type Stm32Run,
} from "@/lib/firmware/emulate/harness/stm32g031-run";
import { writeFolder } from "./files";
import { mustRun, requireTool } from "./require-tool";

export type { RunOptions, Stm32Run, Stm32Timer } from "@/lib/firmware/emulate/harness/stm32g031-run";

export interface Stm32Build {
  dir: string;
  elf: string;
  bin: string;
  hex: string;
}

let unicornChecked = false;
function requireUnicorn(): void {
  if (unicornChecked) return;
  requireTool(STM32_PYTHON, "python3");
  const r = spawnSync(STM32_PYTHON, ["-c", "import unicorn"], { encoding: "utf8" });
  if (r.status !== 0)
    throw new Error(
      "python3-unicorn is missing: apt-get install -y python3-unicorn (scripts/test.sh installs it)",
    );
  unicornChecked = true;
}

/** Writes the folder, optionally edits src/main.c (planted faults), runs `make -s -C`. */
export function buildStm32(
  files: BundleFile[],
  folder: string,
  editMain?: (text: string) => string,
): Stm32Build {
  requireTool("arm-none-eabi-gcc", "gcc-arm-none-eabi");
  requireTool("make", "make");
  const dir = writeFolder(files, folder);
  if (editMain) {
    const main = path.join(dir, "src/main.c");
    const before = readFileSync(main, "utf8");
    const after = editMain(before);
    if (after === before) throw new Error("the planted fault did not change src/main.c");
    writeFileSync(main, after);
  }
  mustRun("make", ["-s", "-C", dir], dir);
  const b = (n: string) => path.join(dir, "build", n);
  return { dir, elf: b("firmware.elf"), bin: b("firmware.bin"), hex: b("firmware.hex") };
}

export function runStm32(elf: string, opts: RunOptions = {}): Stm32Run {
  requireUnicorn();
  return runStm32Sync(elf, opts);
}
