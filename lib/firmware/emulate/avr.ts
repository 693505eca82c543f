// ATmega328P and ATtiny85 images in simavr (Debian libsimavr 1.6): the exact
// <folder>/firmware/firmware.hex the bundle ships runs in the harness
// harness/simavr/pin-trace.c, which writes the output pin to a VCD file; the
// edges are judged against the plan (judge.ts). Free-running plans only: a
// triggered or zero-cross plan needs a driven input and answers not-emulated.
// Server-only: runs gcc and the harness.
import { execFile } from "node:child_process";
import { mkdtemp, readFile, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { simavrHarnessBinary, simavrMissing } from "./harness/simavr-build";
import { parseVcd } from "./harness/vcd";
import { judgeEdges, MIN_PERIODS } from "./judge";
import { DEFAULT_TIMEOUT_MS, emulatorsOff, notEmulated, runLengthS } from "./switches";
import type { DeviceEmulator, EmulationInput, EmulationResult } from "./types";

const run = promisify(execFile);

/** simavr core names of the devices this wrapper runs. */
const SIMAVR_CORES: Record<string, string> = { atmega328p: "atmega328p", attiny85: "attiny85" };

let toolName: Promise<string> | null = null;

/** "simavr <version>" from the Debian package, else plain "libsimavr" (the library prints no version). */
function simavrTool(): Promise<string> {
  toolName ??= run("dpkg-query", ["-W", "-f", "${Version}", "libsimavr-dev"], { timeout: 10_000 })
    .then(({ stdout }) => `simavr ${stdout.trim()}`)
    .catch(() => "libsimavr");
  return toolName;
}

/** The image this wrapper runs, inside the target folder (index.ts names it in the stored result). */
export const AVR_IMAGE = "firmware/firmware.hex";

/** Why this input cannot run here, or null. */
function refusal(input: EmulationInput): EmulationResult | null {
  const core = SIMAVR_CORES[input.device];
  if (!core) return notEmulated(`simavr wrapper has no core for ${input.device}.`);
  if (input.kind !== "periodic")
    return notEmulated(
      `The emulator run covers free-running plans; a ${input.kind} plan needs its input driven, which is not wired in the product yet.`,
    );
  if (!input.clockHz) return notEmulated("No CPU clock given for the simavr run.");
  if (!/^P[A-D][0-7]$/.test(input.planned.pin))
    return notEmulated(`Output pin ${input.planned.pin} is not an AVR port pin the harness can trace.`);
  if (!input.files.some((f) => f.path === `${input.folder}/${AVR_IMAGE}`))
    return notEmulated(`The target has no ${input.folder}/${AVR_IMAGE} to run.`);
  return null;
}

export const emulateAvr: DeviceEmulator = async (input) => {
  const off = emulatorsOff() ?? refusal(input);
  if (off) return off;
  const missing = simavrMissing();
  if (missing) return notEmulated(`Not run: ${missing}.`);
  const lengthS = runLengthS(input.planned.periodS, MIN_PERIODS);
  if (typeof lengthS !== "number") return lengthS;
  const clockHz = input.clockHz!;
  const tool = await simavrTool();
  let bin: string;
  try {
    bin = simavrHarnessBinary("pin-trace");
  } catch (e) {
    return notEmulated(`Not run: ${(e as Error).message.split("\n")[0]}`, tool);
  }
  const hex = input.files.find((f) => f.path === `${input.folder}/${AVR_IMAGE}`)!;
  const dir = await mkdtemp(path.join(tmpdir(), "cg-emu-avr-"));
  const timeoutMs = input.timeoutMs ?? DEFAULT_TIMEOUT_MS;
  try {
    await writeFile(path.join(dir, "image.hex"), hex.content);
    const port = input.planned.pin.charAt(1);
    const bit = input.planned.pin.slice(2);
    const cycles = Math.ceil(lengthS * clockHz);
    try {
      await run(
        bin,
        [SIMAVR_CORES[input.device], String(clockHz), "image.hex", port, bit, String(cycles), "pin.vcd"],
        { cwd: dir, timeout: timeoutMs, maxBuffer: 1024 * 1024 },
      );
    } catch (e) {
      const err = e as { killed?: boolean; signal?: string; stderr?: string; code?: number };
      if (err.killed || err.signal === "SIGTERM")
        return notEmulated(`The simavr run did not finish within ${timeoutMs / 1000} s.`, tool);
      // A crashed core (exit 7) is the image's fault: the pin's edges so far are judged below.
      if (err.code !== 7)
        return notEmulated(`simavr could not run the image: ${err.stderr?.trim() ?? ""}`, tool);
    }
    const vcd = await readFile(path.join(dir, "pin.vcd"), "utf8");
    const edges = parseVcd(vcd, input.planned.pin);
    // simavr counts whole CPU cycles: one cycle of resolution at the pin.
    return judgeEdges(input, edges, { tool, emulatedS: cycles / clockHz, stepS: 1 / clockHz });
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
};
