// Compiles one of the libsimavr harnesses in ./simavr/<name>.c with the host
// gcc, once per source content (the binary's folder is named by the source's
// sha256, written under a temporary name and renamed, so two processes never
// run a half-written binary). Used by the product's AVR emulator wrapper
// (../avr.ts) and by the firmware tests. Server-only: runs gcc.
import { execFileSync, spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, renameSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";

export type SimavrHarness = "pin-trace" | "switch-trace" | "trigger-trace";

const HEADER = "/usr/include/simavr/sim_avr.h";

/** The harness source folder (the worker and the tests run from the repository root). */
export function harnessSourceDir(): string {
  return path.join(process.cwd(), "lib/firmware/emulate/harness/simavr");
}

function onPath(command: string): boolean {
  return spawnSync("sh", ["-c", `command -v ${command}`], { stdio: "ignore" }).status === 0;
}

/** Why the harness cannot be built here (plain words, with the Debian package), or null. */
export function simavrMissing(): string | null {
  if (!onPath("gcc"))
    return "gcc is not installed (Debian package gcc), so the simavr harness cannot be built";
  if (!existsSync(HEADER)) return "libsimavr is not installed (Debian package libsimavr-dev)";
  return null;
}

/** Returns the path of the compiled harness, compiling it first when needed. Throws with gcc's output. */
export function simavrHarnessBinary(name: SimavrHarness): string {
  const source = path.join(harnessSourceDir(), `${name}.c`);
  const src = readFileSync(source);
  const dir = path.join(
    tmpdir(),
    `cg-simavr-${name}-${createHash("sha256").update(src).digest("hex").slice(0, 12)}`,
  );
  const bin = path.join(dir, name);
  if (existsSync(bin)) return bin;
  mkdirSync(dir, { recursive: true });
  const tmp = `${bin}.${process.pid}.${Math.random().toString(36).slice(2)}`;
  try {
    execFileSync(
      "gcc",
      [
        "-O1",
        "-Wall",
        "-Werror",
        "-I/usr/include/simavr",
        "-I/usr/include/simavr/avr",
        "-o",
        tmp,
        source,
        "-lsimavr",
      ],
      { cwd: dir, stdio: ["ignore", "pipe", "pipe"], timeout: 120_000 },
    );
  } catch (e) {
    const err = e as { stderr?: Buffer; message: string };
    throw new Error(
      `gcc could not build the simavr harness ${name}: ${err.stderr?.toString() || err.message}`,
    );
  }
  renameSync(tmp, bin);
  return bin;
}
