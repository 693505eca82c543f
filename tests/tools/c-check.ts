// Host gcc syntax check against the test-only device stubs in ./stubs, and
// the arm-none-eabi-gcc freestanding build (gcc manual: -fsyntax-only,
// -ffreestanding, -nostdlib; ld manual: -T, --gc-sections).
import path from "node:path";
import type { BundleFile } from "@/lib/bundle";
import { writeFolder } from "./files";
import { mustRun, requireTool, run, type RunResult } from "./require-tool";

export const STUBS_DIR = path.join(process.cwd(), "tests/tools/stubs");

export function hostSyntaxCheck(dir: string): RunResult {
  requireTool("gcc", "gcc");
  return run(
    "gcc",
    [
      "-fsyntax-only",
      "-std=c11",
      "-Wall",
      "-Wextra",
      "-Wno-unknown-pragmas",
      "-Werror",
      "-I",
      STUBS_DIR,
      "src/main.c",
    ],
    dir,
  );
}

export function syntaxCheckFolder(files: BundleFile[], folder: string): RunResult {
  return hostSyntaxCheck(writeFolder(files, folder));
}

export function buildArm(files: BundleFile[], folder: string): { dir: string; size: string } {
  requireTool("arm-none-eabi-gcc", "gcc-arm-none-eabi");
  const dir = writeFolder(files, folder);
  mustRun(
    "arm-none-eabi-gcc",
    [
      "-mcpu=cortex-m0plus",
      "-mthumb",
      "-Os",
      "-std=c11",
      "-Wall",
      "-Wextra",
      "-Werror",
      "-ffreestanding",
      "-nostdlib",
      "-ffunction-sections",
      "-fdata-sections",
      "-T",
      "src/device.ld",
      "-Wl,--gc-sections",
      "-o",
      "out.elf",
      "src/startup.c",
      "src/main.c",
      "-lgcc",
    ],
    dir,
  );
  const size = mustRun("arm-none-eabi-size", ["out.elf"], dir).stdout;
  return { dir, size };
}
