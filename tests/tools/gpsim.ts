// Build a generated PIC12F1840 folder with its own Makefile (gpasm, Debian
// gputils) for the tests; the gpsim runner lives with the product's emulator
// wrapper (lib/firmware/emulate/harness/gpsim.ts) and is re-exported here.
import { readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import type { BundleFile } from "@/lib/bundle";
import { writeFolder } from "./files";
import { mustRun, requireTool } from "./require-tool";

export * from "@/lib/firmware/emulate/harness/gpsim";

/** Writes the folder, optionally edits src/main.asm (planted faults), runs `make`; returns the folder. */
export function buildPic(files: BundleFile[], folder: string, edit?: (asm: string) => string): string {
  requireTool("gpasm", "gputils");
  const dir = writeFolder(files, folder);
  if (edit) {
    const asm = path.join(dir, "src/main.asm");
    const before = readFileSync(asm, "utf8");
    const after = edit(before);
    if (after === before) throw new Error("planted fault changed nothing in src/main.asm");
    writeFileSync(asm, after);
  }
  mustRun("make", ["-s", "-C", dir], dir);
  return dir;
}
