// Pieces every device wrapper shares: the plain not-emulated answers, the
// image and source files of the target folder, a private temporary copy of
// an image for the emulator, and the verdict from the measured numbers.
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { emulatorsOff, notEmulated } from "../switches";
import type { EmulationInput, EmulationResult } from "../types";

export { notEmulated };

/**
 * The answer for the cases every wrapper refuses the same way: emulators off
 * on this deployment, or a plan kind the wrapper does not drive. null = go on.
 */
export function commonRefusal(
  input: EmulationInput,
  device: string,
  kinds: readonly string[],
): EmulationResult | null {
  const off = emulatorsOff();
  if (off) return off;
  if (!kinds.includes(input.kind))
    return notEmulated(
      `The ${device} emulator wrapper drives ${kinds.join(" and ")} plans only; this plan is "${input.kind}", so nothing was run.`,
    );
  if (fileOf(input, "src/adc_control.h") || fileOf(input, "src/adc_control.inc"))
    return notEmulated(
      `This ${device} image sets its output from a potentiometer on the ADC; the wrapper gives the emulator no analog input, so nothing was run.`,
    );
  return null;
}

/** A file of the target folder by its path inside the folder ("firmware/firmware.elf"). */
export function fileOf(input: EmulationInput, inner: string): Uint8Array | string | null {
  const f = input.files.find((x) => x.path === `${input.folder}/${inner}`);
  return f ? f.content : null;
}

export function textOf(input: EmulationInput, inner: string): string | null {
  const c = fileOf(input, inner);
  return c === null ? null : typeof c === "string" ? c : Buffer.from(c).toString("utf8");
}

/** A `#define NAME 1234UL` value from a source text, or null. */
export function defineValue(text: string | null, name: string): number | null {
  const m = text ? new RegExp(`^#define ${name} (\\d+)[uUlL]*\\s*$`, "m").exec(text) : null;
  return m ? Number(m[1]) : null;
}

/** The package named for the output signal in pinmap.csv, or null. */
export function outputPackage(input: EmulationInput): string | null {
  const csv = textOf(input, "pinmap.csv");
  const row = csv?.split(/\r?\n/).find((l) => l.startsWith("TIMING_OUT,"));
  return row?.split(",")[4] ?? null;
}

/** Writes files into a private temporary folder, runs `fn` there, and removes the folder. */
export async function withTempFiles<T>(
  files: Record<string, Uint8Array | string>,
  fn: (dir: string) => Promise<T>,
): Promise<T> {
  const dir = await mkdtemp(path.join(tmpdir(), "cg-emu-"));
  try {
    for (const [name, content] of Object.entries(files)) await writeFile(path.join(dir, name), content);
    return await fn(dir);
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

/** Seconds in the unit that keeps them readable; a hair under a unit boundary (float error) counts as above it. */
const fmt = (s: number) => {
  const a = Math.abs(s) * (1 + 1e-9);
  if (a >= 1) return `${s.toPrecision(7)} s`;
  if (a >= 1e-3) return `${(s * 1e3).toPrecision(7)} ms`;
  if (a >= 1e-6) return `${(s * 1e6).toPrecision(7)} us`;
  return `${(s * 1e9).toPrecision(7)} ns`;
};

/**
 * "agrees" when nothing is wrong with the set-up and both numbers are within
 * the input's tolerance of the plan, else "differs" naming each difference.
 * `basis` says how the numbers were measured (pin edges or registers).
 */
export function verdict(
  input: EmulationInput,
  measured: { periodS: number; highS: number; edges: EmulationResult["edges"]; emulatedS: number },
  basis: string,
  tool: string,
  problems: string[],
): EmulationResult {
  const { periodS, highS } = measured;
  const dp = periodS - input.planned.periodS;
  const dh = highS - input.planned.highS;
  const found = [...problems];
  if (!(Math.abs(dp) <= input.toleranceS.period))
    found.push(
      `period ${fmt(periodS)} is ${fmt(dp)} off the planned ${fmt(input.planned.periodS)} (tolerance ${fmt(input.toleranceS.period)})`,
    );
  if (!(Math.abs(dh) <= input.toleranceS.high))
    found.push(
      `high time ${fmt(highS)} is ${fmt(dh)} off the planned ${fmt(input.planned.highS)} (tolerance ${fmt(input.toleranceS.high)})`,
    );
  const numbers = `period ${fmt(periodS)}, high ${fmt(highS)} on ${input.planned.pin}`;
  const base = { tool, periodS, highS, edges: measured.edges, emulatedS: measured.emulatedS };
  if (found.length === 0)
    return { verdict: "agrees", reason: `${basis}: ${numbers}, within tolerance of the plan.`, ...base };
  return { verdict: "differs", reason: `${basis}: ${numbers}. Differs: ${found.join("; ")}.`, ...base };
}

/** A run that produced no numbers (the image hung, or its output never changed): "differs" with the reason. */
export function differsWithout(reason: string, tool: string, emulatedS?: number): EmulationResult {
  return emulatedS === undefined
    ? { verdict: "differs", reason, tool }
    : { verdict: "differs", reason, tool, emulatedS };
}
