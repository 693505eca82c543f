// RP2040 images in rp2040js (npm package): the shipped <folder>/firmware/firmware.elf
// is loaded as flash, booted as the ROM hands over (harness/rp2040-boot.ts:
// stage-2 CRC check, RESETS modelled) and the output GPIO's edges are judged
// against the plan (judge.ts). rp2040js 1.4.1 drives edge-aligned PWM and
// GPIO writes onto the pin but not phase-correct PWM: such an image answers
// not-emulated, with the PWM registers it left read back for the reviewer.
// Triggered and zero-cross plans: the input GPIO is held high from reset and
// then driven (GPIOPin.setInputValue from a clock alarm) as judge-trigger.ts
// schedules it; the output's edges are judged as pulses. Server-only.
import { readFile } from "node:fs/promises";
import { createRequire } from "node:module";
import path from "node:path";
import { formatEng } from "@/lib/engine/units";
import { elfFlashContent } from "./harness/image-readers";
import { judgeEdges, MIN_PERIODS } from "./judge";
import { driveSchedule, inputChanges, judgeTriggered } from "./judge-trigger";
import { DEFAULT_TIMEOUT_MS, emulatorsOff, MAX_EMULATED_S, notEmulated, runLengthS } from "./switches";
import type { DeviceEmulator, EmulationInput, EmulationResult } from "./types";

/** Emulated time the XOSC and PLL start-up may take before the first edge (generous, as the image tests allow). */
/** The image this wrapper runs, inside the target folder (index.ts names it in the stored result). */
export const RP2040_IMAGE = "firmware/firmware.elf";
const START_UP_S = 0.2;
/** XOSC, PLL and set-up before the first input change of a triggered plan (the firmware tests use 20 ms). */
const TRIGGER_START_UP_S = 0.05;
const FLASH_BASE = 0x10000000;
const PWM_BASE = 0x40050000;

type Boot = typeof import("./harness/rp2040-boot");

let tool: Promise<string | null> | null = null;

/** "rp2040js <version>", or null when the package is not installed on this deployment. */
function rp2040jsTool(): Promise<string | null> {
  tool ??= (async () => {
    try {
      const main = createRequire(import.meta.url).resolve("rp2040js");
      const pkg = path.join(main.slice(0, main.lastIndexOf(`${path.sep}dist${path.sep}`)), "package.json");
      return `rp2040js ${(JSON.parse(await readFile(pkg, "utf8")) as { version: string }).version}`;
    } catch {
      return null;
    }
  })();
  return tool;
}

/** GPIO number of "GPIO15" / "GP15". */
function gpioOf(pin: string): number | null {
  const m = /^GP(?:IO)?(\d+)$/.exec(pin);
  return m && Number(m[1]) < 30 ? Number(m[1]) : null;
}

function refusal(input: EmulationInput): EmulationResult | null {
  if (input.device !== "rp2040") return notEmulated(`rp2040js runs RP2040 images, not ${input.device}.`);
  if (!["periodic", "triggered", "zero-cross"].includes(input.kind))
    return notEmulated(`rp2040js runs free-running, triggered and zero-cross plans, not ${input.kind}.`);
  if (input.kind !== "periodic" && gpioOf(input.trigger?.input ?? "") === null)
    return notEmulated(`The ${input.kind} plan names no RP2040 input GPIO to drive.`);
  if (gpioOf(input.planned.pin) === null)
    return notEmulated(`Output pin ${input.planned.pin} is not an RP2040 GPIO.`);
  if (!input.files.some((f) => f.path === `${input.folder}/${RP2040_IMAGE}`))
    return notEmulated(`The target has no ${input.folder}/${RP2040_IMAGE} to run.`);
  return null;
}

/** RP2040 datasheet, PWM: slice = (GPIO / 2) mod 8; CSR bit 1 PH_CORRECT; DIV 8.4; TOP; CC (A low half, B high half). */
function phaseCorrectNote(
  rp: { readUint32(a: number): number },
  gpio: number,
  clkSysHz: number,
): string | null {
  const slice = (gpio >> 1) & 7;
  const reg = (off: number) => rp.readUint32(PWM_BASE + 0x14 * slice + off) >>> 0;
  if ((reg(0x00) & 2) === 0) return null;
  const div = reg(0x04);
  const divider = (div >> 4) + (div & 15) / 16;
  const cc = gpio & 1 ? reg(0x0c) >>> 16 : reg(0x0c) & 0xffff;
  const periodS = ((reg(0x10) + 1) * 2 * divider) / clkSysHz;
  const highS = (2 * cc * divider) / clkSysHz;
  return `rp2040js does not drive phase-correct PWM onto the pin, so the output was not emulated; the image's PWM registers read back give a period of ${formatEng(periodS, "s", 6)} and a high time of ${formatEng(highS, "s", 6)} (RP2040 datasheet, PWM).`;
}

export const emulateRp2040: DeviceEmulator = async (input) => {
  const off = emulatorsOff() ?? refusal(input);
  if (off) return off;
  const name = await rp2040jsTool();
  if (!name) return notEmulated("Not run: the rp2040js package is not installed on this deployment.");
  const drive = input.kind === "periodic" ? null : driveSchedule(input, TRIGGER_START_UP_S, MAX_EMULATED_S);
  if (drive && !("halfS" in drive)) return { ...drive, tool: name };
  const lengthS = drive ? drive.lengthS : runLengthS(input.planned.periodS, MIN_PERIODS, START_UP_S);
  if (typeof lengthS !== "number") return lengthS;
  const ins = drive ? inputChanges(drive) : [];
  const inGpio = drive ? gpioOf(input.trigger!.input)! : -1;
  let boot: Boot;
  try {
    boot = await import("./harness/rp2040-boot");
  } catch (e) {
    return notEmulated(`Not run: rp2040js did not load: ${(e as Error).message}`, name);
  }
  const elf = input.files.find((f) => f.path === `${input.folder}/${RP2040_IMAGE}`)!;
  const gpio = gpioOf(input.planned.pin)!;
  let flash: Uint8Array;
  try {
    const image = elfFlashContent(elf.content as Uint8Array);
    if (image.base !== FLASH_BASE)
      return notEmulated("The ELF image does not start at the RP2040 flash base.", name);
    flash = image.bytes;
  } catch (e) {
    return notEmulated(`The ELF image could not be read: ${(e as Error).message}`, name);
  }
  const timeoutMs = input.timeoutMs ?? DEFAULT_TIMEOUT_MS;
  let run: ReturnType<Boot["bootAndRun"]>;
  try {
    run = boot.bootAndRun(flash, {
      gpio,
      edgesWanted: drive ? Number.MAX_SAFE_INTEGER : 2 * (MIN_PERIODS + 3),
      maxNs: lengthS * 1e9,
      maxInstructions: 200_000_000,
      maxWallMs: timeoutMs,
      ...(drive
        ? {
            setup: (rp) => {
              // Idle high (the pull-up) from reset, then the schedule's changes.
              rp.gpio[inGpio].setInputValue(true);
              let i = 0;
              const alarm = rp.clock.createAlarm(() => {
                rp.gpio[inGpio].setInputValue(ins[i].level === 1);
                i++;
                if (i < ins.length) alarm.schedule((ins[i].t - ins[i - 1].t) * 1e9);
              });
              alarm.schedule(ins[0].t * 1e9);
            },
          }
        : {}),
    });
  } catch (e) {
    // The ROM would refuse this image: that is the image's fault, not a missing tool.
    if (e instanceof boot.BootRefused)
      return {
        verdict: "differs",
        reason: `The boot ROM would not start this image: ${e.message}.`,
        tool: name,
      };
    throw e;
  }
  if (run.timedOut) return notEmulated(`The rp2040js run did not finish within ${timeoutMs / 1000} s.`, name);
  const phase = phaseCorrectNote(run.rp, gpio, run.clkSysHz);
  if (phase) return notEmulated(phase, name);
  const edges = run.edges.map((e) => ({ t: e.ns / 1e9, level: e.high ? (1 as const) : (0 as const) }));
  const emulatedS = (run.rp.clock as unknown as { nanos: number }).nanos / 1e9;
  if (drive)
    // GPIO writes and PWM events land at instruction boundaries: one clk_sys cycle.
    return judgeTriggered(input, ins, edges, {
      tool: name,
      emulatedS,
      stepS: 1 / run.clkSysHz,
      schedule: drive,
    });
  // PWM edges come from rp2040js's timer alarms at exact times (float rounding
  // only); GPIO writes land at instruction boundaries, covered by an interrupt
  // plan's jitter (its latency bound).
  return judgeEdges(input, edges, { tool: name, emulatedS, stepS: 1e-3 / run.clkSysHz });
};
