// Runs a bundle's AVR image (the exact firmware.hex it ships) in libsimavr
// through lib/firmware/emulate/harness/simavr/pin-trace.c and measures one pin from the VCD it
// writes. The harness is compiled once per source content with the host gcc.
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { BundleFile } from "@/lib/bundle";
import {
  simavrHarnessBinary,
  simavrMissing,
  type SimavrHarness,
} from "@/lib/firmware/emulate/harness/simavr-build";
import { mustRun, requireTool } from "./require-tool";
import { measure, parseVcd, type Measured } from "@/lib/firmware/emulate/harness/vcd";

/** The lib harness (lib/firmware/emulate/harness/simavr/<name>.c), compiled once; a missing tool fails the test with the package. */
export function simavrHarness(name: SimavrHarness): string {
  requireTool("gcc", "gcc");
  const missing = simavrMissing();
  if (missing) throw new Error(`${missing}: apt-get install -y libsimavr-dev`);
  return simavrHarnessBinary(name);
}

export interface PinRun {
  measured: Measured;
  /** number of edges seen */
  edges: number;
}

/** Runs `<folder>/firmware/firmware.hex` for `cycles` CPU cycles and measures pin P<port><bit>. */
export function runAvrImage(
  files: BundleFile[],
  folder: string,
  mcu: string,
  clockHz: number,
  port: string,
  bit: number,
  cycles: number,
): PinRun {
  const bin = simavrHarness("pin-trace");
  const hex = files.find((f) => f.path === `${folder}/firmware/firmware.hex`);
  if (!hex) throw new Error(`bundle has no ${folder}/firmware/firmware.hex`);
  const dir = path.join(tmpdir(), `cg-simavr-run-${process.pid}-${Math.random().toString(36).slice(2)}`);
  mkdirSync(dir, { recursive: true });
  writeFileSync(path.join(dir, "image.hex"), hex.content);
  mustRun(
    bin,
    [mcu, String(clockHz), "image.hex", port, String(bit), String(Math.ceil(cycles)), "pin.vcd"],
    dir,
    120_000,
  );
  const edges = parseVcd(readFileSync(path.join(dir, "pin.vcd"), "utf8"), `P${port}${bit}`);
  return { measured: measure(edges), edges: edges.length };
}

export interface Expected {
  periodS: number;
  highS: number;
  /** seconds per timer count (divider / clock) */
  countS: number;
  /** seconds per emulator step (one CPU cycle) */
  stepS: number;
  /** extra allowance on the high time (interrupt plans: set/clear path difference) */
  extraHighS?: number;
  minPeriods: number;
}

/** What is wrong with a measured pin against the requested timing; empty when it matches. */
export function timingProblems(run: PinRun, e: Expected): string[] {
  const tol = 0.5 * e.countS + e.stepS;
  // the first period holds the start-up; the last high time may be cut by the end of the run
  const periods = run.measured.periods.slice(1);
  const highs = run.measured.highs.slice(1, -1);
  const out: string[] = [];
  if (periods.length < e.minPeriods)
    out.push(`only ${periods.length} full periods seen (${run.edges} edges), wanted ${e.minPeriods}`);
  for (const p of periods)
    if (Math.abs(p - e.periodS) > tol) out.push(`period ${p} s is not ${e.periodS} s within ${tol} s`);
  for (const h of highs)
    if (Math.abs(h - e.highS) > tol + (e.extraHighS ?? 0))
      out.push(`high time ${h} s is not ${e.highS} s within ${tol + (e.extraHighS ?? 0)} s`);
  return [...new Set(out)];
}
