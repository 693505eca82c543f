// Run a PIC12F1840 image in gpsim (Debian gpsim 0.31, processor p12f1840)
// in command mode. What gpsim 0.31 shows and what it lacks was tried on this
// machine:
// - the CCP1 PWM output is driven onto RA2 and reads back through PORTA;
// - cycle counts are instruction cycles (Fosc/4); gpsim does not derive time
//   from OSCCON, so the clock is decoded from the registers by the caller;
// - OSCSTAT reads 0x39 whatever is selected: HFIOFR is set, but MFIOFR and
//   PLLR never are, so an image that waits for those (62.5/31.25 kHz, 4x PLL)
//   cannot get past its wait here and is checked from registers instead;
// - a `break c N` that falls inside a two-cycle instruction never fires, so
//   the pin is sampled with `step` (one instruction, at most two cycles);
// - a command gpsim cannot parse drops it into its prompt for good (it then
//   spins on the closed stdin): every run needs a time cap.
// `image` is the file gpsim loads, relative to `dir`: the tests load
// build/firmware.cod (with symbols), the product the bundle's firmware.hex.
// Each run has a synchronous form (the tests) and an Async form (the product).
import { readFileSync, writeFileSync } from "node:fs";
import { readFile, writeFile } from "node:fs/promises";
import path from "node:path";
import { spawnSync } from "node:child_process";
import { runTool, toolVersion } from "./tool";

const TEST_IMAGE = "build/firmware.cod";

function script(image: string, commands: string[]): string {
  return ["processor p12f1840", `load ${image}`, ...commands, "quit", ""].join("\n");
}

// stdin closed: without a command on it gpsim would wait for one. Output to
// a file: a long pin trace is more than a pipe buffer holds.
const SHELL = "exec gpsim -i -c run.stc </dev/null >run.out 2>&1";

function gpsim(dir: string, commands: string[], image = TEST_IMAGE): string {
  writeFileSync(path.join(dir, "run.stc"), script(image, commands));
  const r = spawnSync("sh", ["-c", SHELL], { cwd: dir, encoding: "utf8", timeout: 120_000 });
  const out = readFileSync(path.join(dir, "run.out"), "utf8");
  if (/gpsim: not found|No such file/.test(out) && r.status === 127)
    throw new Error("gpsim is not installed: apt-get install -y gpsim (scripts/test.sh installs it)");
  if (r.status !== 0) throw new Error(`gpsim failed (${r.status}):\n${out.slice(-4000)}`);
  return out;
}

/** A gpsim run that did not finish; the wrapper answers not-emulated with its message. */
export class GpsimFailure extends Error {}

async function gpsimAsync(
  dir: string,
  commands: string[],
  image: string,
  timeoutMs: number,
): Promise<string> {
  await writeFile(path.join(dir, "run.stc"), script(image, commands));
  const r = await runTool("sh", ["-c", SHELL], { timeoutMs, cwd: dir });
  if (r.timedOut) throw new GpsimFailure(`the gpsim run took longer than ${timeoutMs} ms and was stopped`);
  const out = await readFile(path.join(dir, "run.out"), "utf8");
  if (r.status !== 0) throw new GpsimFailure(`gpsim failed (${r.status}): ${out.slice(-300)}`);
  if (/\*\*\*ERROR/.test(out))
    throw new GpsimFailure(`gpsim refused a command: ${/\*\*\*ERROR[^\n]*/.exec(out)![0]}`);
  return out;
}

/** "gpsim-0.31.0", or null when gpsim is not installed. */
export function gpsimVersion(): Promise<string | null> {
  return toolVersion("gpsim", "gpsim", ["--version"], (out) => {
    const m = /gpsim-\S+/.exec(out);
    return m ? m[0] : null;
  });
}

export interface PinSample {
  cycle: number;
  level: 0 | 1;
}

/**
 * A voltage on one RA pin through gpsim's module library (libgpsim_modules,
 * "pullup": a source of `volts` behind 100 ohm), for the ADC: gpsim 0.31
 * converts the pin voltage against VDD (5 V) when the pin is analog.
 */
export function analogSource(pin: string, volts: number): string[] {
  return [
    "module library libgpsim_modules",
    "module load pullup wiper_src",
    `wiper_src.voltage = ${volts}`,
    "wiper_src.resistance = 100",
    "node wiper_node",
    `attach wiper_node wiper_src.pin ${pin.toLowerCase()}`,
  ];
}

/** Runs to `fromCycle`, then samples RA<bit> after each of `steps` instructions; `setup` runs first (stimuli). */
export function tracePin(
  dir: string,
  bit: number,
  fromCycle: number,
  steps: number,
  setup: string[] = [],
  image = TEST_IMAGE,
): PinSample[] {
  return parseTrace(gpsim(dir, traceCommands(fromCycle, steps, setup), image), bit, fromCycle, steps);
}

export async function tracePinAsync(
  dir: string,
  bit: number,
  fromCycle: number,
  steps: number,
  image: string,
  timeoutMs: number,
): Promise<PinSample[]> {
  const out = await gpsimAsync(dir, traceCommands(fromCycle, steps, []), image, timeoutMs);
  return parseTrace(out, bit, fromCycle, steps);
}

function traceCommands(fromCycle: number, steps: number, setup: string[]): string[] {
  const cmds = [...setup, `break c ${fromCycle}`, "run"];
  for (let i = 0; i < steps; i++) cmds.push("step", "cycles", "porta");
  return cmds;
}

function parseTrace(out: string, bit: number, fromCycle: number, steps: number): PinSample[] {
  const samples: PinSample[] = [];
  const re = /(\d+) = 0x[0-9A-Fa-f]+\s*\n\s*porta = 0x([0-9A-Fa-f]+)/g;
  for (let m = re.exec(out); m; m = re.exec(out)) {
    samples.push({ cycle: Number(m[1]), level: (Number.parseInt(m[2], 16) >> bit) & 1 ? 1 : 0 });
  }
  if (samples.length < steps)
    throw new Error(
      `gpsim gave ${samples.length} of ${steps} samples; did the run reach cycle ${fromCycle}?`,
    );
  return samples;
}

/** One write to LATA logged by gpsim: instruction cycle and the value written. */
export interface LatchWrite {
  cycle: number;
  value: number;
}

/**
 * A digital input on one RA pin (gpsim's asynchronous_stimulus): level 0 until
 * the first change, then `level` from each `cycle` (instruction cycles) on.
 */
export function pinStimulus(pin: string, changes: { cycle: number; level: 0 | 1 }[]): string[] {
  const last = changes.length ? changes[changes.length - 1].cycle : 0;
  return [
    "stimulus asynchronous_stimulus",
    "initial_state 0",
    "start_cycle 0",
    // one period longer than the whole list, so it never repeats within a run
    `period ${last + 10_000_000}`,
    `{ ${changes.map((c) => `${c.cycle}, ${c.level}`).join(", ")} }`,
    "name input_src",
    "end",
    "node input_node",
    `attach input_node input_src ${pin.toLowerCase().replace(/^ra/, "porta")}`,
  ];
}

/** Runs `cycles` instruction cycles logging every write to LATA (gpsim `log w`); `setup` runs first (stimuli). */
export function latchWrites(
  dir: string,
  cycles: number,
  setup: string[] = [],
  image = TEST_IMAGE,
): LatchWrite[] {
  const log = path.join(dir, "lata.log");
  gpsim(dir, [...setup, ...latchCommands(log, cycles)], image);
  return parseLatch(readFileSync(log, "utf8"));
}

export async function latchWritesAsync(
  dir: string,
  cycles: number,
  image: string,
  timeoutMs: number,
  setup: string[] = [],
): Promise<LatchWrite[]> {
  const log = path.join(dir, "lata.log");
  await gpsimAsync(dir, [...setup, ...latchCommands(log, cycles)], image, timeoutMs);
  return parseLatch(await readFile(log, "utf8"));
}

function latchCommands(log: string, cycles: number): string[] {
  return [`log on ${log}`, "log w lata", `break c ${cycles}`, "run", "log off"];
}

function parseLatch(text: string): LatchWrite[] {
  const got: LatchWrite[] = [];
  const re = /^0x([0-9A-Fa-f]+) p12f1840 .*movwf\s+lata[\s\S]*?Wrote: 0x([0-9A-Fa-f]+) to lata/gm;
  for (let m = re.exec(text); m; m = re.exec(text)) {
    got.push({ cycle: Number.parseInt(m[1], 16), value: Number.parseInt(m[2], 16) });
  }
  return got;
}

/** Register values (gpsim's lower-case symbols) after running `cycles` instruction cycles; `setup` runs first. */
export function registersAt(
  dir: string,
  cycles: number,
  names: string[],
  setup: string[] = [],
  image = TEST_IMAGE,
): Record<string, number> {
  return parseRegisters(gpsim(dir, registerCommands(cycles, names, setup), image), names);
}

export async function registersAtAsync(
  dir: string,
  cycles: number,
  names: string[],
  image: string,
  timeoutMs: number,
): Promise<Record<string, number>> {
  return parseRegisters(await gpsimAsync(dir, registerCommands(cycles, names, []), image, timeoutMs), names);
}

function registerCommands(cycles: number, names: string[], setup: string[]): string[] {
  return [...setup, `break c ${cycles}`, "run", ...names.map((n) => n.toLowerCase())];
}

function parseRegisters(out: string, names: string[]): Record<string, number> {
  const regs: Record<string, number> = {};
  for (const n of names) {
    const m = new RegExp(`\\b${n.toLowerCase()} = 0x([0-9A-Fa-f]+)`).exec(out);
    if (!m) throw new Error(`gpsim printed no value for ${n}:\n${out.slice(-2000)}`);
    regs[n] = Number.parseInt(m[1], 16);
  }
  return regs;
}

export interface PinTiming {
  /** Mean period over the whole rising-to-rising periods seen, instruction cycles. */
  periodCycles: number;
  /** Mean high time over the same periods, instruction cycles. */
  highCycles: number;
  periods: number;
}

/** Period and high time from a sampled trace; null when the pin does not toggle twice. */
export function pinTiming(samples: PinSample[]): PinTiming | null {
  const rises: number[] = [];
  const falls: number[] = [];
  for (let i = 1; i < samples.length; i++) {
    const a = samples[i - 1];
    const b = samples[i];
    if (a.level === 0 && b.level === 1) rises.push(b.cycle);
    if (a.level === 1 && b.level === 0 && rises.length > 0) falls.push(b.cycle);
  }
  if (rises.length < 2 || falls.length < 1) return null;
  const periods = rises.length - 1;
  let high = 0;
  let n = 0;
  for (let k = 0; k < periods; k++) {
    const f = falls.find((x) => x > rises[k] && x < rises[k + 1]);
    if (f !== undefined) {
      high += f - rises[k];
      n++;
    }
  }
  return { periodCycles: (rises[periods] - rises[0]) / periods, highCycles: n ? high / n : 0, periods };
}

/** Configuration words CONFIG1/CONFIG2 at word addresses 0x8007/0x8008 of an Intel HEX image. */
export function configWords(hexPath: string): { config1: number; config2: number } {
  const bytes = new Map<number, number>();
  let base = 0;
  for (const line of readFileSync(hexPath, "utf8").split(/\r?\n/)) {
    if (!line.startsWith(":")) continue;
    const raw = Buffer.from(line.slice(1), "hex");
    const sum = raw.reduce((s, b) => (s + b) & 0xff, 0);
    if (sum !== 0) throw new Error(`bad checksum in ${line}`);
    const len = raw[0];
    const addr = (raw[1] << 8) | raw[2];
    const type = raw[3];
    if (type === 4) base = ((raw[4] << 8) | raw[5]) << 16;
    if (type === 0) for (let i = 0; i < len; i++) bytes.set(base + addr + i, raw[4 + i]);
  }
  // Byte address = 2 x word address, low byte first (gpasm's inhx32 output).
  const word = (w: number) => {
    const lo = bytes.get(2 * w);
    const hi = bytes.get(2 * w + 1);
    if (lo === undefined || hi === undefined) throw new Error(`no word at 0x${w.toString(16)} in ${hexPath}`);
    return (hi << 8) | lo;
  };
  return { config1: word(0x8007), config2: word(0x8008) };
}
