// Runs an MSP430 ELF in mspdebug's simulator (Debian package mspdebug 0.22,
// `mspdebug sim`) with its simio devices: timer (Timer_A), gpio, wdt
// (Watchdog Timer+, resets the CPU when it expires) and tracer (clock
// counters MCLK/SMCLK/ACLK and the IO write history). The simulator models
// no Basic Clock Module (its ACLK is a fixed fraction of SMCLK, no oscillator
// fault), no factory calibration data and no Timer_A output unit, so tests
// check the clock set-up from the IO writes the image makes and the output
// from the timer registers. Each run has a synchronous form (the tests) and
// an Async form for the product (no blocking, wall-clock cap).
import { spawnSync } from "node:child_process";
import { runTool, toolVersion } from "./tool";

/** Test-only DCO calibration bytes at 0x10F8..0x10FF (CALDCO_16MHZ .. CALBC1_1MHZ); any value but 0xFF is "calibrated". */
export const SIM_CALIBRATION = [0x95, 0x8f, 0x9e, 0x8e, 0x92, 0x8d, 0xb5, 0x86] as const;

export interface SimOptions {
  /** Write SIM_CALIBRATION into information memory before running (a real G2553 has it from the factory). */
  calibration?: boolean;
  /** Add the Watchdog Timer+ model (default true). */
  watchdog?: boolean;
  /**
   * Bytes written into the simulator's memory before running. The simulator
   * has no ADC10, but a byte written at ADC10MEM (0x01B4) stays there, so an
   * image reads it as its conversion result.
   */
  memory?: { addr: number; bytes: number[] }[];
  /** Give port 1 its interrupt (the gpio device's `irq` vector slot, 2 = PORT1 on the G2553). */
  p1Irq?: number;
}

export interface IsrStop {
  pc: number;
  smclk: number;
  aclk: number;
  /** P1 output state printed by the gpio device after the previous stop ("---- -H--"), if it changed. */
  p1Changes: string[];
}

export interface TimerSample {
  smclk: number;
  aclk: number;
  tactl: number;
  tar: number;
  ccr: number[];
  cctl: number[];
}

export interface IoWrite {
  at: number;
  width: "b" | "w";
  addr: number;
  value: number;
}

function devices(o: SimOptions): string[] {
  const cmds = [
    // Timer0_A3 at 0x0160, TA0IV at 0x012E, CCR0 vector slot 9 (0xFFF2), CCR1/TAIFG slot 8 (0xFFF0): SLAS735 tables
    "simio add timer ta0 3",
    "simio config ta0 base 0x160",
    "simio config ta0 iv 0x12e",
    "simio config ta0 irq0 9",
    "simio config ta0 irq1 8",
    // P1 at 0x0020, P2 at 0x0028 (SLAS735 peripheral file map)
    "simio add gpio p1",
    "simio config p1 base 0x20",
    "simio config p1 verbose",
    ...(o.p1Irq !== undefined ? [`simio config p1 irq ${o.p1Irq}`] : []),
    "simio add gpio p2",
    "simio config p2 base 0x28",
    "simio add tracer tr 4096",
  ];
  if (o.watchdog !== false) cmds.push("simio add wdt wdt");
  if (o.calibration !== false)
    cmds.push(`mw 0x10f8 ${SIM_CALIBRATION.map((b) => `0x${b.toString(16)}`).join(" ")}`);
  for (const m of o.memory ?? [])
    cmds.push(`mw 0x${m.addr.toString(16)} ${m.bytes.map((b) => `0x${b.toString(16)}`).join(" ")}`);
  return cmds;
}

function simArgs(elf: string, cmds: string[]): string[] {
  return ["-q", "sim", `prog ${elf}`, ...cmds];
}

function mspdebug(elf: string, cmds: string[], timeoutMs: number): string {
  const r = spawnSync("mspdebug", simArgs(elf, cmds), {
    encoding: "utf8",
    timeout: timeoutMs,
    maxBuffer: 64 * 1024 * 1024,
  });
  if ((r.error as NodeJS.ErrnoException | undefined)?.code === "ENOENT")
    throw new Error("mspdebug is not installed: apt-get install -y mspdebug (scripts/test.sh installs it)");
  if (r.error) throw r.error;
  if (r.status !== 0)
    throw new Error(`mspdebug sim failed (${r.status}):\n${r.stderr}${r.stdout.slice(-2000)}`);
  return r.stdout;
}

/** The product's run: the simulator's output, or a plain failure (time cap, exit status). */
async function mspdebugAsync(elf: string, cmds: string[], timeoutMs: number): Promise<string> {
  const r = await runTool("mspdebug", simArgs(elf, cmds), { timeoutMs });
  if (r.missing) throw new SimFailure("mspdebug is not installed");
  if (r.timedOut) throw new SimFailure(`the simulator run took longer than ${timeoutMs} ms and was stopped`);
  if (r.status !== 0)
    throw new SimFailure(`mspdebug sim failed (${r.status}): ${(r.stderr || r.stdout).trim().slice(-300)}`);
  return r.stdout;
}

/** A simulator run that did not finish; the wrapper answers not-emulated with its message. */
export class SimFailure extends Error {}

/** "MSPDebug version 0.22", or null when mspdebug is not installed. */
export function mspdebugVersion(): Promise<string | null> {
  return toolVersion("mspdebug", "mspdebug", ["--version"], (out) => {
    const m = /MSPDebug version \S+/.exec(out);
    return m ? m[0] : null;
  });
}

const num = (re: RegExp, text: string, what: string, radix = 10): number => {
  const m = re.exec(text);
  if (!m) throw new Error(`mspdebug output has no ${what}:\n${text.slice(0, 1500)}`);
  return Number.parseInt(m[1], radix);
};

function clocks(block: string): { smclk: number; aclk: number } {
  return {
    smclk: num(/SMCLK\s+(\d+)/, block, "SMCLK counter"),
    aclk: num(/ACLK:\s+(\d+)/, block, "ACLK counter"),
  };
}

/**
 * Breaks at `isrSymbol` and at `resetSymbol`, runs `stops` times and returns
 * every stop with the clock counters. A stop at the reset entry means the CPU
 * was reset (watchdog, PUC): the caller sees it in `pc`.
 */
export function runToBreaks(
  elf: string,
  isrSymbol: string,
  resetSymbol: string,
  stops: number,
  o: SimOptions = {},
): { stops: IsrStop[]; io: IoWrite[] } {
  return parseBreaks(mspdebug(elf, breakCommands(isrSymbol, resetSymbol, stops, o), 120_000));
}

export async function runToBreaksAsync(
  elf: string,
  isrSymbol: string,
  resetSymbol: string,
  stops: number,
  o: SimOptions,
  timeoutMs: number,
): Promise<{ stops: IsrStop[]; io: IoWrite[] }> {
  return parseBreaks(await mspdebugAsync(elf, breakCommands(isrSymbol, resetSymbol, stops, o), timeoutMs));
}

function breakCommands(isrSymbol: string, resetSymbol: string, stops: number, o: SimOptions): string[] {
  const cmds = [...devices(o), `setbreak ${isrSymbol}`, `setbreak ${resetSymbol}`];
  for (let i = 0; i < stops; i++) cmds.push("run", "simio info tr");
  return cmds;
}

function parseBreaks(out: string): { stops: IsrStop[]; io: IoWrite[] } {
  const parts = out.split("Running. Press Ctrl+C to interrupt...").slice(1);
  const result: IsrStop[] = [];
  for (const part of parts) {
    const pcm = /\( PC: ([0-9a-f]+)\)/.exec(part);
    if (!pcm) continue;
    const { smclk, aclk } = clocks(part);
    const p1Changes = [...part.matchAll(/state change on p1: ([-LHlh]{4} [-LHlh]{4})/g)].map((m) => m[1]);
    result.push({ pc: Number.parseInt(pcm[1], 16), smclk, aclk, p1Changes });
  }
  return { stops: result, io: ioWrites(out) };
}

/**
 * Steps `settle` simulator steps (start-up, then one SMCLK cycle per step in
 * LPM0), then takes `samples` timer samples `stepCycles` SMCLK cycles apart.
 */
export function sampleTimer(
  elf: string,
  settle: number,
  stepCycles: number,
  samples: number,
  o: SimOptions = {},
): { samples: TimerSample[]; io: IoWrite[]; resets: number } {
  return parseSamples(mspdebug(elf, sampleCommands(settle, stepCycles, samples, o), 120_000));
}

export async function sampleTimerAsync(
  elf: string,
  settle: number,
  stepCycles: number,
  samples: number,
  o: SimOptions,
  timeoutMs: number,
): Promise<{ samples: TimerSample[]; io: IoWrite[]; resets: number }> {
  const out = parseSamples(
    await mspdebugAsync(elf, sampleCommands(settle, stepCycles, samples, o), timeoutMs),
  );
  // One sample after the settle steps and one per step: fewer means the run ended early (seen under heavy
  // load with exit status 0), and the wrapper must say so rather than read a sample that is not there.
  if (out.samples.length < samples + 1)
    throw new SimFailure(
      `the simulator's output ended after ${out.samples.length} of ${samples + 1} timer samples`,
    );
  return out;
}

function sampleCommands(settle: number, stepCycles: number, samples: number, o: SimOptions): string[] {
  const cmds = [...devices(o), `step ${settle}`, "simio info ta0", "simio info tr"];
  for (let i = 0; i < samples; i++) cmds.push(`step ${stepCycles}`, "simio info ta0", "simio info tr");
  return cmds;
}

function parseSamples(out: string): { samples: TimerSample[]; io: IoWrite[]; resets: number } {
  const blocks = out.split("Base address: 0x0160").slice(1);
  const list = blocks.map((b): TimerSample => {
    const ccr: number[] = [];
    const cctl: number[] = [];
    for (const m of b.matchAll(/Channel\s+(\d), TACTL = 0x([0-9a-f]+), TACCR = 0x([0-9a-f]+)/g)) {
      cctl[Number(m[1])] = Number.parseInt(m[2], 16);
      ccr[Number(m[1])] = Number.parseInt(m[3], 16);
    }
    return {
      ...clocks(b),
      tactl: num(/TACTL:\s+0x([0-9a-f]+)/, b, "TACTL", 16),
      tar: num(/TAR:\s+0x([0-9a-f]+)/, b, "TAR", 16),
      ccr,
      cctl,
    };
  });
  const hist = out.split("IO event history (oldest first):").pop() ?? "";
  return { samples: list, io: ioWrites(out), resets: [...hist.matchAll(/system reset/g)].length };
}

function ioWrites(out: string): IoWrite[] {
  // The tracer prints its whole history at every "simio info tr": keep the last, longest copy.
  const histories = out.split("IO event history (oldest first):").slice(1);
  const last = histories[histories.length - 1] ?? "";
  return [...last.matchAll(/^\s+(\d+): write\.([bw]) => 0x([0-9a-f]+) 0x([0-9a-f]+)/gm)].map((m) => ({
    at: Number(m[1]),
    width: m[2] as "b" | "w",
    addr: Number.parseInt(m[3], 16),
    value: Number.parseInt(m[4], 16),
  }));
}

/** The value of the last write to `addr`, or undefined. */
export function lastWrite(io: IoWrite[], addr: number): number | undefined {
  let v: number | undefined;
  for (const w of io) if (w.addr === addr) v = w.value;
  return v;
}

/**
 * Timer period in counts from TAR samples taken a whole number of counts
 * apart: between two samples the counter advances by d counts modulo N, so a
 * wrap gives N = TAR_i + d - TAR_(i+1). Returns every N seen (empty when the
 * counter never wrapped or never ran).
 */
export function periodsFromSamples(s: TimerSample[], divider: number, useAclk = false): number[] {
  const out: number[] = [];
  for (let i = 1; i < s.length; i++) {
    const dt = useAclk ? s[i].aclk - s[i - 1].aclk : s[i].smclk - s[i - 1].smclk;
    const d = dt / divider;
    if (s[i].tar === s[i - 1].tar && d > 0) continue; // stopped (or a whole period exactly)
    if (s[i].tar < s[i - 1].tar + d) out.push(s[i - 1].tar + d - s[i].tar);
  }
  return out;
}

/**
 * Bounded look before running to breakpoints (a `run` that never meets a
 * breakpoint would not return): steps `steps` simulator steps (each at least
 * one SMCLK cycle) and counts accepted interrupts in the given vector slot and
 * CPU resets in the tracer's history.
 */
export function countEvents(
  elf: string,
  steps: number,
  slot: number,
  o: SimOptions = {},
): { irqs: number; resets: number; io: IoWrite[] } {
  return parseEvents(mspdebug(elf, [...devices(o), `step ${steps}`, "simio info tr"], 120_000), slot);
}

export async function countEventsAsync(
  elf: string,
  steps: number,
  slot: number,
  o: SimOptions,
  timeoutMs: number,
): Promise<{ irqs: number; resets: number; io: IoWrite[] }> {
  return parseEvents(
    await mspdebugAsync(elf, [...devices(o), `step ${steps}`, "simio info tr"], timeoutMs),
    slot,
  );
}

function parseEvents(out: string, slot: number): { irqs: number; resets: number; io: IoWrite[] } {
  const hist = out.split("IO event history (oldest first):").pop() ?? "";
  return {
    irqs: [...hist.matchAll(new RegExp(`irq handle ${slot}\\b`, "g"))].length,
    resets: [...hist.matchAll(/system reset/g)].length,
    io: ioWrites(out),
  };
}

/** One input change: run `steps` simulator steps, then set P1.<pin> to `level`. */
export interface InputChange {
  steps: number;
  pin: number;
  level: 0 | 1;
}

/**
 * Drives P1 input pins through the gpio device (`simio config p1 set`) after
 * the given numbers of steps, then runs `tailSteps` more. Returns the MCLK
 * count at each change (read from the tracer just before it) and the IO write
 * history, whose stamps are MCLK counts too.
 */
export function runWithInputs(
  elf: string,
  changes: InputChange[],
  tailSteps: number,
  o: SimOptions = {},
): InputsRun {
  return inputsRunOf(mspdebug(elf, inputCommands(changes, tailSteps, o), 120_000), changes);
}

/** The product's run of runWithInputs: a plain SimFailure on the time cap or a failed run. */
export async function runWithInputsAsync(
  elf: string,
  changes: InputChange[],
  tailSteps: number,
  o: SimOptions,
  timeoutMs: number,
): Promise<InputsRun> {
  return inputsRunOf(await mspdebugAsync(elf, inputCommands(changes, tailSteps, o), timeoutMs), changes);
}

export interface InputsRun {
  changeAt: number[];
  io: IoWrite[];
  irqs: { at: number; slot: number }[];
}

function inputCommands(changes: InputChange[], tailSteps: number, o: SimOptions): string[] {
  const cmds = [...devices(o)];
  for (const c of changes)
    cmds.push(`step ${c.steps}`, "simio info tr", `simio config p1 set ${c.pin} ${c.level}`);
  cmds.push(`step ${tailSteps}`, "simio info tr");
  return cmds;
}

function inputsRunOf(out: string, changes: InputChange[]): InputsRun {
  const mclk = [...out.matchAll(/MCLK:\s+(\d+)/g)].map((m) => Number(m[1]));
  if (mclk.length !== changes.length + 1)
    throw new Error(`mspdebug printed ${mclk.length} clock readings for ${changes.length + 1}`);
  const hist = out.split("IO event history (oldest first):").pop() ?? "";
  const irqs = [...hist.matchAll(/^\s+(\d+): irq handle (\d+)/gm)].map((m) => ({
    at: Number(m[1]),
    slot: Number(m[2]),
  }));
  return { changeAt: mclk.slice(0, changes.length), io: ioWrites(out), irqs };
}
