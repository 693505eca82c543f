// The compilers each device's Makefile runs (firmware.md, Toolchains table)
// and the first line of their `--version` output, which the bundle README
// records so a reviewer can rebuild the images with the same versions.
// Server-only: runs the Debian toolchains.
import { execFile } from "node:child_process";
import { promisify } from "node:util";
import { reproducibleEnv } from "./build-images";

const run = promisify(execFile);

/** Commands whose version decides the image bytes, per device. */
export const TOOLCHAIN_COMMANDS: Record<string, string[]> = {
  atmega328p: ["avr-gcc", "avr-objcopy"],
  attiny85: ["avr-gcc", "avr-objcopy"],
  stm32g031: ["arm-none-eabi-gcc", "arm-none-eabi-objcopy"],
  rp2040: ["arm-none-eabi-gcc", "arm-none-eabi-objcopy"],
  msp430g2553: ["clang", "ld.lld"],
  pic12f1840: ["gpasm"],
};

const cache = new Map<string, Promise<string>>();

async function versionLine(command: string): Promise<string> {
  try {
    const { stdout, stderr } = await run(command, ["--version"], { env: reproducibleEnv(), timeout: 20_000 });
    const first = `${stdout}\n${stderr}`.split(/\r?\n/).find((l) => l.trim() !== "");
    return first?.trim() ?? "no version output";
  } catch {
    return "not installed";
  }
}

/** "command: first line of --version" for every toolchain the devices use, sorted, no duplicates. */
export async function toolchainVersions(devices: string[]): Promise<string[]> {
  const commands = [...new Set(devices.flatMap((d) => TOOLCHAIN_COMMANDS[d] ?? []))].sort();
  return Promise.all(
    commands.map(async (c) => {
      let p = cache.get(c);
      if (!p) {
        p = versionLine(c);
        cache.set(c, p);
      }
      return `${c}: ${await p}`;
    }),
  );
}
