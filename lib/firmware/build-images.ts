// Builds the ready-to-flash images of one target folder with the bundle's own
// Makefile (`make -C <folder>`, firmware.md build contract) in a private
// temporary directory, and returns the image files as bundle files under
// <folder>/firmware/. Server-only: it runs the Debian toolchains.
import { execFile } from "node:child_process";
import { mkdtemp, mkdir, readFile, readdir, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import type { BundleFile } from "@/lib/bundle/types";

const run = promisify(execFile);

/** Image names the build contract allows, in the order they are listed. */
export const IMAGE_NAMES = ["firmware.bin", "firmware.elf", "firmware.hex", "firmware.uf2"] as const;

export class FirmwareBuildError extends Error {
  constructor(
    readonly device: string,
    readonly folder: string,
    /** The compiler's (or make's) first error line. */
    readonly firstMessage: string,
  ) {
    super(`${device} (${folder}): the image did not build: ${firstMessage}`);
    this.name = "FirmwareBuildError";
  }
}

/** The first line of compiler output that reads as an error, else the first non-empty line. */
export function firstErrorLine(output: string): string {
  const lines = output
    .split(/\r?\n/)
    .map((l) => l.trim())
    .filter(Boolean);
  const isError = (l: string) => /\b(error|Error|ERROR|undefined reference|No rule)\b/.test(l);
  // make's own "*** [...] Error 1" comes last on stderr; the tool's message (gpasm prints to stdout) first
  return (
    lines.find((l) => isError(l) && !/^make(\[\d+\])?: \*\*\*.*Error \d+$/.test(l)) ??
    lines.find(isError) ??
    lines[0] ??
    "no output"
  );
}

/** Environment for reproducible builds: fixed locale, time and no user flags. */
export function reproducibleEnv(): NodeJS.ProcessEnv {
  return {
    NODE_ENV: process.env.NODE_ENV,
    PATH: process.env.PATH ?? "/usr/bin:/bin",
    LC_ALL: "C",
    TZ: "UTC",
    SOURCE_DATE_EPOCH: "946684800",
    HOME: tmpdir(),
  };
}

async function writeFolder(root: string, files: BundleFile[], folder: string): Promise<void> {
  for (const f of files) {
    if (!f.path.startsWith(`${folder}/`) || f.path.startsWith(`${folder}/firmware/`)) continue;
    const dest = path.join(root, f.path);
    await mkdir(path.dirname(dest), { recursive: true });
    await writeFile(dest, f.content);
  }
}

/**
 * Runs `make -C <folder>` on a copy of the folder's files and returns
 * `<folder>/firmware/<image>` for every image the build made.
 * Throws FirmwareBuildError naming the device and the first compiler message.
 */
export async function buildTargetImages(
  files: BundleFile[],
  folder: string,
  device: string,
  opts: { timeoutMs?: number } = {},
): Promise<BundleFile[]> {
  // The same path on every build, so nothing path-dependent differs between two builds.
  const root = await mkdtemp(path.join(tmpdir(), "cg-fw-"));
  const work = path.join(root, "b");
  try {
    await mkdir(work);
    await writeFolder(work, files, folder);
    try {
      await run("make", ["-s", "-C", path.join(work, folder)], {
        env: reproducibleEnv(),
        timeout: opts.timeoutMs ?? 120_000,
        maxBuffer: 8 * 1024 * 1024,
      });
    } catch (e) {
      const err = e as { stderr?: string; stdout?: string; message?: string; code?: string };
      if (err.code === "ENOENT") throw new FirmwareBuildError(device, folder, "make is not installed");
      const out = `${err.stderr ?? ""}\n${err.stdout ?? ""}`;
      throw new FirmwareBuildError(device, folder, firstErrorLine(out.trim() ? out : (err.message ?? "")));
    }
    const buildDir = path.join(work, folder, "build");
    const made = new Set(await readdir(buildDir).catch(() => [] as string[]));
    const images: BundleFile[] = [];
    for (const name of IMAGE_NAMES) {
      if (!made.has(name)) continue;
      images.push({
        path: `${folder}/firmware/${name}`,
        content: new Uint8Array(await readFile(path.join(buildDir, name))),
      });
    }
    if (!images.some((i) => i.path.endsWith(".hex")))
      throw new FirmwareBuildError(device, folder, "the build made no firmware.hex");
    return images;
  } finally {
    await rm(root, { recursive: true, force: true });
  }
}
