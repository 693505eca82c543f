// Build a generated STM32G031 folder with its own Makefile (firmware.md build
// contract: `make -C <folder>` into build/) and run the ELF in the
// python3-unicorn harness ./stm32g031-emu.py (our own code; Debian
// python3-unicorn under /usr/bin/python3).
import { spawnSync } from "node:child_process";
import { readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import type { BundleFile } from "@/lib/bundle";
import { writeFolder } from "./files";
import { mustRun, requireTool } from "./require-tool";

const HARNESS = path.join(process.cwd(), "tests/tools/stm32g031-emu.py");
const PYTHON = "/usr/bin/python3";

export interface Stm32Build {
  dir: string;
  elf: string;
  bin: string;
  hex: string;
}

export interface Stm32Timer {
  CR1: number;
  DIER: number;
  SR: number;
  CCMR1: number;
  CCMR2: number;
  CCER: number;
  PSC: number;
  ARR: number;
  CCR1: number;
  CCR2: number;
  CCR3: number;
  CCR4: number;
  [reg: string]: number;
}

export interface Stm32Run {
  idle: { pc: number; kind: string } | null;
  steps: number;
  error?: string;
  stuck?: { pc: number; polled: string; reads: number; pending: string[] };
  resetVector: number;
  handler?: number;
  isrCalls: { level: number; uifCleared: boolean }[];
  sysclkHz: number | null;
  rcc: { CR: number; CFGR: number; PLLCFGR: number; IOPENR: number; APBENR1: number };
  flashAcr: number;
  nvicIser: number;
  timers: Record<"TIM2" | "TIM3", Stm32Timer>;
  gpio: Record<"A" | "B" | "C", Record<string, number>>;
  /** Triggered plans: one entry per edge raised on the EXTI line (tests/tools/stm32g031-emu.py). */
  edgeCalls?: {
    edge: "rising" | "falling";
    called: boolean;
    handler?: number;
    error?: string;
    /** the handler's writes: [register, value, ARMv6-M cycles spent before the write] */
    writes?: [string, number, number][];
    cycles?: number;
    pendingAfter: boolean;
    timers: Record<"TIM2" | "TIM3", { CR1: number; CNT: number }>;
  }[];
  exti?: { RTSR1: number; FTSR1: number; EXTICR1: number; IMR1: number };
  vtor?: number;
  /** Every peripheral write in order: [register name, value]. */
  writes: [string, number][];
  faults: string[];
}

export interface RunOptions {
  package?: string;
  /** Frequency of the clock fed into PC14-OSC_IN; omitted = nothing connected. */
  extClockHz?: number;
  maxInstructions?: number;
  /** Interrupt plans: IRQ number (RM0444 vector table) and how many handler calls. */
  isrIrq?: number;
  isrCalls?: number;
  pinPort?: string;
  pinBit?: number;
  /** Triggered plans: EXTI IRQ (RM0444 vector table), line, and the edges to raise in order. */
  extiIrq?: number;
  extiLine?: number;
  edges?: ("rising" | "falling")[];
}

function requireUnicorn(): void {
  requireTool(PYTHON, "python3");
  const r = spawnSync(PYTHON, ["-c", "import unicorn"], { encoding: "utf8" });
  if (r.status !== 0)
    throw new Error(
      "python3-unicorn is missing: apt-get install -y python3-unicorn (scripts/test.sh installs it)",
    );
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
  const arg = JSON.stringify({ elf, package: "TSSOP-20", maxInstructions: 200_000, ...opts });
  const r = spawnSync(PYTHON, [HARNESS, arg], { encoding: "utf8", timeout: 60_000, maxBuffer: 16 << 20 });
  if (r.status !== 0) throw new Error(`stm32g031 harness failed (${r.status}): ${r.stderr}${r.stdout}`);
  return JSON.parse(r.stdout) as Stm32Run;
}
