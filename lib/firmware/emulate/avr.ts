// ATmega328P and ATtiny85 images in simavr (Debian libsimavr 1.6): the exact
// <folder>/firmware/firmware.hex the bundle ships runs in the harness
// harness/simavr/pin-trace.c, which writes the output pin to a VCD file; the
// edges are judged against the plan (judge.ts). Triggered and zero-cross
// plans run in harness/simavr/trigger-trace.c, which drives the input pin as
// judge-trigger.ts schedules it; the pulses are judged there.
// Budget in CPU cycles, not seconds: simavr's speed is per executed cycle.
// Measured here on a shared 2-core machine: an image that busy-waits in its
// main loop ran about 12 M cycles per wall-clock second, one that sleeps
// between interrupts over 100 M. 120 M cycles (7.5 s emulated at 16 MHz, 15 s
// at 8 MHz) stays inside the 30 s wall-clock cap, which still holds.
// Server-only: runs gcc and the harness.
import { mkdtemp, readFile, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { simavrHarnessBinary, simavrMissing } from "./harness/simavr-build";
import { runTool } from "./harness/tool";
import { parseVcd } from "./harness/vcd";
import { judgeEdges, MIN_PERIODS, type PinEdge } from "./judge";
import { driveSchedule, judgeTriggered, type DriveSchedule } from "./judge-trigger";
import { DEFAULT_TIMEOUT_MS, emulatorsOff, notEmulated, runLengthS } from "./switches";
import type { DeviceEmulator, EmulationInput, EmulationResult } from "./types";

/** simavr core names of the devices this wrapper runs. */
const SIMAVR_CORES: Record<string, string> = { atmega328p: "atmega328p", attiny85: "attiny85" };

let toolName: Promise<string> | null = null;

/** "simavr <version>" from the Debian package, else plain "libsimavr" (the library prints no version). */
function simavrTool(): Promise<string> {
  toolName ??= runTool("dpkg-query", ["-W", "-f", "${Version}", "libsimavr-dev"], { timeoutMs: 10_000 }).then(
    (r) => (r.status === 0 && !r.timedOut && r.stdout.trim() ? `simavr ${r.stdout.trim()}` : "libsimavr"),
  );
  return toolName;
}

/** The image this wrapper runs, inside the target folder (index.ts names it in the stored result). */
export const AVR_IMAGE = "firmware/firmware.hex";
/** CPU cycles one simavr run may cover (see the budget note above). */
export const SIMAVR_MAX_CYCLES = 120e6;
/** Time the image is given to set up before the first input change. */
const TRIGGER_START_UP_S = 5e-3;

const AVR_PIN = /^P[A-D][0-7]$/;

/** Why this input cannot run here, or null. */
function refusal(input: EmulationInput): EmulationResult | null {
  const core = SIMAVR_CORES[input.device];
  if (!core) return notEmulated(`simavr wrapper has no core for ${input.device}.`);
  if (!["periodic", "triggered", "zero-cross"].includes(input.kind))
    return notEmulated(
      `The simavr run covers free-running, triggered and zero-cross plans, not ${input.kind}.`,
    );
  if (!input.clockHz) return notEmulated("No CPU clock given for the simavr run.");
  if (!AVR_PIN.test(input.planned.pin))
    return notEmulated(`Output pin ${input.planned.pin} is not an AVR port pin the harness can trace.`);
  if (input.kind !== "periodic" && !AVR_PIN.test(input.trigger?.input ?? ""))
    return notEmulated(`The ${input.kind} plan names no AVR input pin the harness can drive.`);
  if (!input.files.some((f) => f.path === `${input.folder}/${AVR_IMAGE}`))
    return notEmulated(`The target has no ${input.folder}/${AVR_IMAGE} to run.`);
  return null;
}

export const emulateAvr: DeviceEmulator = async (input) => {
  const off = emulatorsOff() ?? refusal(input);
  if (off) return off;
  const missing = simavrMissing();
  if (missing) return notEmulated(`Not run: ${missing}.`);
  const budgetS = SIMAVR_MAX_CYCLES / input.clockHz!;
  const drive = input.kind === "periodic" ? null : driveSchedule(input, TRIGGER_START_UP_S, budgetS);
  if (drive && !("halfS" in drive)) return drive;
  const lengthS = drive ? drive.lengthS : runLengthS(input.planned.periodS, MIN_PERIODS, 0, budgetS);
  if (typeof lengthS !== "number") return lengthS;
  const clockHz = input.clockHz!;
  const tool = await simavrTool();
  let bin: string;
  try {
    bin = simavrHarnessBinary(drive ? "trigger-trace" : "pin-trace");
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
    const core = SIMAVR_CORES[input.device];
    const args = drive
      ? [core, String(clockHz), "image.hex", port, bit, ...driveArgs(input, drive, clockHz), String(cycles)]
      : [core, String(clockHz), "image.hex", port, bit, String(cycles), "pin.vcd"];
    const r = await runTool(bin, args, { cwd: dir, timeoutMs, maxBuffer: 8 * 1024 * 1024 });
    if (r.timedOut) return notEmulated(`The simavr run did not finish within ${timeoutMs / 1000} s.`, tool);
    // A crashed core (exit 7) is the image's fault: the pin's edges so far are judged below.
    if (r.status !== 0 && r.status !== 7)
      return notEmulated(`simavr could not run the image: ${r.stderr.trim()}`, tool);
    const stdout = r.stdout;
    const stepS = 1 / clockHz;
    if (drive) {
      const { ins, outs } = parseTriggerTrace(stdout, clockHz);
      return judgeTriggered(input, ins, outs, { tool, emulatedS: cycles / clockHz, stepS, schedule: drive });
    }
    const vcd = await readFile(path.join(dir, "pin.vcd"), "utf8");
    const edges = parseVcd(vcd, input.planned.pin);
    // simavr counts whole CPU cycles: one cycle of resolution at the pin.
    return judgeEdges(input, edges, { tool, emulatedS: cycles / clockHz, stepS });
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
};

/** trigger-trace arguments: input port and bit, first change and half period in cycles. */
function driveArgs(input: EmulationInput, drive: DriveSchedule, clockHz: number): string[] {
  const pin = input.trigger!.input;
  return [
    pin.charAt(1),
    pin.slice(2),
    String(Math.round(drive.firstS * clockHz)),
    String(Math.round(drive.halfS * clockHz)),
  ];
}

/** trigger-trace's "in <cycle> <level>" / "out <cycle> <0|1|z>" lines as edges in seconds (z and x left out). */
function parseTriggerTrace(stdout: string, clockHz: number): { ins: PinEdge[]; outs: PinEdge[] } {
  const ins: PinEdge[] = [];
  const outs: PinEdge[] = [];
  for (const line of stdout.split("\n")) {
    const [kind, cycle, level] = line.split(" ");
    if ((kind !== "in" && kind !== "out") || (level !== "0" && level !== "1")) continue;
    (kind === "in" ? ins : outs).push({ t: Number(cycle) / clockHz, level: level === "1" ? 1 : 0 });
  }
  return { ins, outs };
}
