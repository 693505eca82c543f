import { mkdirSync, mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { BundleFile } from "@/lib/bundle";

/** Write one target folder of a bundle into a fresh temp dir; returns that folder. */
export function writeFolder(files: BundleFile[], folder: string): string {
  const root = mkdtempSync(path.join(tmpdir(), "cg-bundle-"));
  const mine = files.filter((f) => f.path.startsWith(folder + "/"));
  if (mine.length === 0) throw new Error(`bundle has no folder ${folder}`);
  for (const f of mine) {
    const p = path.join(root, f.path);
    mkdirSync(path.dirname(p), { recursive: true });
    writeFileSync(p, f.content);
  }
  return path.join(root, folder);
}
