// Runs an STM32G031 firmware ELF in our python3-unicorn harness
// (./stm32g031-emu.py, Debian python3-unicorn under /usr/bin/python3): from
// the reset vector to the idle loop, every peripheral access logged, and on
// request the timer handler or the EXTI handler called as the NVIC would.
// runStm32Sync serves the tests; runStm32Harness the product (no blocking).
import { spawnSync } from "node:child_process";
import path from "node:path";
import { runTool, toolVersion } from "./tool";

export const STM32_HARNESS = path.join(process.cwd(), "lib/firmware/emulate/harness/stm32g031-emu.py");
/** Debian's interpreter: python3-unicorn is installed for it, not for other pythons on PATH. */
export const STM32_PYTHON = "/usr/bin/python3";

/** The interpreter the product runs the harness with: CLOCKGRAFT_UNICORN_PYTHON, else Debian's. */
export function harnessPython(): string {
  return process.env.CLOCKGRAFT_UNICORN_PYTHON || STM32_PYTHON;
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
  /** Triggered plans: one entry per edge raised on the EXTI line. */
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

function harnessArg(elf: string, opts: RunOptions): string {
  return JSON.stringify({ elf, package: "TSSOP-20", maxInstructions: 200_000, ...opts });
}

/** "python3-unicorn 2.0.1", or null when the interpreter or its unicorn module is missing. */
export function unicornVersion(): Promise<string | null> {
  const python = harnessPython();
  return toolVersion(`python3-unicorn:${python}`, python, [STM32_HARNESS, "--version"], (out) => {
    const m = /python3-unicorn \S+/.exec(out);
    return m ? m[0] : null;
  });
}

/** Synchronous run for the tests; throws with the harness output when it fails. */
export function runStm32Sync(elf: string, opts: RunOptions = {}): Stm32Run {
  const r = spawnSync(STM32_PYTHON, [STM32_HARNESS, harnessArg(elf, opts)], {
    encoding: "utf8",
    timeout: 60_000,
    maxBuffer: 16 << 20,
  });
  if (r.status !== 0) throw new Error(`stm32g031 harness failed (${r.status}): ${r.stderr}${r.stdout}`);
  return JSON.parse(r.stdout) as Stm32Run;
}

/** The product's run: never blocks, answers a plain failure instead of throwing. */
export async function runStm32Harness(
  elf: string,
  opts: RunOptions,
  timeoutMs: number,
): Promise<{ run: Stm32Run } | { failure: string }> {
  const r = await runTool(harnessPython(), [STM32_HARNESS, harnessArg(elf, opts)], { timeoutMs });
  if (r.timedOut) return { failure: `the unicorn run took longer than ${timeoutMs} ms and was stopped` };
  if (r.status !== 0)
    return { failure: `the unicorn harness failed: ${(r.stderr || r.stdout).trim().slice(-400)}` };
  return { run: JSON.parse(r.stdout) as Stm32Run };
}
