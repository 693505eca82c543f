// Builds a triggered AVR bundle target with its own Makefile and runs it in
// lib/firmware/emulate/harness/simavr/trigger-trace.c, which drives the input pin; returns the
// input and output changes by CPU cycle.
import { mkdirSync, mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { BundleFile } from "@/lib/bundle";
import { mustRun, requireTool } from "./require-tool";
import { simavrHarness } from "./simavr";

/** Writes the folder's files, optionally edits src/main.c (planted faults), runs make; returns the hex path. */
export function buildFolder(files: BundleFile[], folder: string, edit?: (mainC: string) => string): string {
  requireTool("avr-gcc", "gcc-avr");
  const root = mkdtempSync(path.join(tmpdir(), "cg-trig-build-"));
  for (const f of files) {
    if (!f.path.startsWith(`${folder}/`) || f.path.includes("/firmware/")) continue;
    const p = path.join(root, f.path);
    mkdirSync(path.dirname(p), { recursive: true });
    let content = f.content;
    if (edit && f.path === `${folder}/src/main.c`) {
      const before = String(content);
      content = edit(before);
      if (content === before) throw new Error("planted fault changed nothing");
    }
    writeFileSync(p, content);
  }
  mustRun("make", ["-s", "-C", path.join(root, folder)], root, 120_000);
  return path.join(root, folder, "build/firmware.hex");
}

export interface Change {
  cycle: number;
  level: string;
}

export interface TriggerRun {
  input: Change[];
  output: Change[];
}

export function runTriggered(
  hex: string,
  o: {
    mcu: string;
    clockHz: number;
    out: string;
    input: string;
    firstCycles: number;
    halfCycles: number;
    cycles: number;
  },
): TriggerRun {
  const r = mustRun(
    simavrHarness("trigger-trace"),
    [
      o.mcu,
      String(o.clockHz),
      hex,
      o.out.charAt(1),
      o.out.slice(2),
      o.input.charAt(1),
      o.input.slice(2),
      String(o.firstCycles),
      String(o.halfCycles),
      String(o.cycles),
    ],
    path.dirname(hex),
    120_000,
  );
  const input: Change[] = [];
  const output: Change[] = [];
  for (const line of r.stdout.split("\n")) {
    const [kind, c, level] = line.split(" ");
    if (kind === "in") input.push({ cycle: Number(c), level });
    if (kind === "out") output.push({ cycle: Number(c), level });
  }
  return { input, output };
}

/** For each input edge of the kind given, the next output pulse (level `on` then back): delay and width in cycles. */
export function pulsesAfter(run: TriggerRun, edge: "rising" | "falling" | "both", on: "1" | "0") {
  const off = on === "1" ? "0" : "1";
  const edges = run.input.filter(
    (e) => edge === "both" || (edge === "rising" ? e.level === "1" : e.level === "0"),
  );
  return edges.map((e) => {
    const i = run.output.findIndex((x) => x.cycle >= e.cycle && x.level === on);
    const start = i >= 0 ? run.output[i] : undefined;
    const end = i >= 0 ? run.output.slice(i + 1).find((x) => x.level === off) : undefined;
    return {
      edge: e.cycle,
      delay: start ? start.cycle - e.cycle : NaN,
      width: start && end ? end.cycle - start.cycle : NaN,
    };
  });
}
