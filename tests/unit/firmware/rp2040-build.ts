// Builds one RP2040 target folder of a bundle with its own Makefile
// (`make -C <folder>`, the build contract of firmware.md) in a temp dir, with
// optional source edits to plant faults, and returns the images.
import { readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import type { BundleFile } from "@/lib/bundle";
import { writeFolder } from "@/tests/tools/files";
import { mustRun, requireTool } from "@/tests/tools/require-tool";

export interface Rp2040Images {
  dir: string;
  elf: Uint8Array;
  hex: string;
  uf2: Uint8Array;
}

/** An edit of one source file: the text must occur exactly once. */
export interface SourceEdit {
  file: string;
  from: string | RegExp;
  to: string | ((match: string) => string);
}

export function applyEdit(dir: string, e: SourceEdit): void {
  const p = path.join(dir, e.file);
  const text = readFileSync(p, "utf8");
  const re =
    typeof e.from === "string" ? new RegExp(e.from.replace(/[.*+?^${}()|[\]\\]/g, "\\$&"), "g") : e.from;
  const hits = text.match(new RegExp(re.source, "g")) ?? [];
  if (hits.length !== 1)
    throw new Error(`planted fault: ${String(e.from)} occurs ${hits.length} times in ${e.file}`);
  writeFileSync(p, text.replace(re, e.to as string));
}

export function buildRp2040(files: BundleFile[], folder: string, edits: SourceEdit[] = []): Rp2040Images {
  requireTool("arm-none-eabi-gcc", "gcc-arm-none-eabi");
  requireTool("make", "make");
  requireTool("python3", "python3");
  const dir = writeFolder(files, folder);
  for (const e of edits) applyEdit(dir, e);
  mustRun("make", ["-s", "-C", dir], dir, 120_000);
  const b = (n: string) => path.join(dir, "build", n);
  return {
    dir,
    elf: new Uint8Array(readFileSync(b("firmware.elf"))),
    hex: readFileSync(b("firmware.hex"), "utf8"),
    uf2: new Uint8Array(readFileSync(b("firmware.uf2"))),
  };
}
