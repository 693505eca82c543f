// MSP430G2553 emulator wrapper: runs the target's firmware.elf in mspdebug's
// simulator (Debian mspdebug, `mspdebug sim`) with its timer, gpio, watchdog
// and tracer devices (harness/mspdebug-sim.ts). The simulator has no Basic
// Clock Module, no factory calibration data (the wrapper writes stand-in
// bytes, so an image that reads its calibration can run) and no Timer_A
// output unit: interrupt plans are measured from the simulated times of the
// handler calls and the P1 levels they write; PWM plans from the counter's
// wrap (TAR samples) and TACCR1. The reason says which.
// Triggered and zero-cross plans: the gpio device drives P1.3 and raises the
// PORT1 interrupt (vector slot 2, SLAS735); the tracer stamps each change and
// each P1OUT write with the MCLK count, and judge-trigger.ts judges the
// pulses (one cycle of resolution). The changes are placed by simulator steps
// (the idle loop's JMP is 2 cycles a step, family guide SLAU144), so the edge
// times used are the stamps the simulator printed, not the schedule's.
// Server-only.
import { driveSchedule, judgeTriggered, type DriveSchedule } from "./judge-trigger";
import type { DeviceEmulator, EmulationInput, EmulationResult } from "./types";
import {
  commonRefusal,
  defineValue,
  differsWithout,
  fileOf,
  notEmulated,
  textOf,
  verdict,
  withTempFiles,
} from "./harness/common";
import { MSP430_REG, msp430Clocks } from "./harness/msp430-clock";
import {
  SimFailure,
  countEventsAsync,
  lastWrite,
  mspdebugVersion,
  periodsFromSamples,
  runToBreaksAsync,
  runWithInputsAsync,
  sampleTimerAsync,
  type InputChange,
} from "./harness/mspdebug-sim";

/** The image this wrapper runs, inside the target folder (index.ts names it in the stored result). */
export const MSP430G2553_IMAGE = "firmware/firmware.elf";
const KINDS = ["periodic", "triggered", "zero-cross"] as const;
/** Steps from reset to the idle loop of a triggered image (DCO calibration, set-up: about 130 cycles). */
const TRIGGER_SETTLE_STEPS = 300;
/** PORT1 interrupt: vector slot 2 (SLAS735 interrupt vector table). */
const PORT1_SLOT = 2;
/** P1OUT address (SLAS735 peripheral file map). */
const P1OUT = 0x21;
/** Simulator steps before the set-up is read: start-up plus the LFXT1 fault-flag wait (about 15000 cycles). */
const SETTLE_STEPS = 60_000;
/** Simulated SMCLK cycles one image may take (about 10 million per second of wall time seen here). */
export const MSP430_MAX_SIM_CYCLES = 25_000_000;
/** mspdebug's simulator runs ACLK at SMCLK/256 (its tracer counters; it has no clock module). */
const SIM_SMCLK_PER_ACLK = 256;
/** The Timer0_A3 CCR0 interrupt: vector slot 9 at 0xFFF2 (SLAS735 interrupt vector table). */
const CCR0_SLOT = 9;

export const emulateMsp430g2553: DeviceEmulator = async (input: EmulationInput): Promise<EmulationResult> => {
  const refused = commonRefusal(input, "MSP430G2553", KINDS);
  if (refused) return refused;
  const elf = fileOf(input, MSP430G2553_IMAGE);
  if (elf === null)
    return notEmulated(`The target has no ${input.folder}/${MSP430G2553_IMAGE} image to run.`);
  const pin = /^P1\.([0-7])$/.exec(input.planned.pin);
  if (!pin)
    return notEmulated(`Output pin ${input.planned.pin} is not a P1 pin the simulator's gpio device shows.`);
  const bit = Number(pin[1]);
  const tool = await mspdebugVersion();
  if (!tool)
    return notEmulated(
      "mspdebug is not installed on this deployment (Debian package mspdebug); nothing was run.",
    );
  const timeoutMs = input.timeoutMs ?? 10_000;
  const started = Date.now();
  const left = () => Math.max(1, timeoutMs - (Date.now() - started));
  const sim = { calibration: true, watchdog: true };
  if (input.kind !== "periodic") return emulateTriggered(input, elf, bit, tool, left);

  return withTempFiles({ "firmware.elf": elf }, async (dir) => {
    const file = `${dir}/firmware.elf`;
    try {
      const first = await sampleTimerAsync(file, SETTLE_STEPS, 1, 0, sim, left());
      const s0 = first.samples[0];
      const problems: string[] = [];
      if (first.resets > 0) problems.push(`the CPU was reset ${first.resets} times (watchdog not held?)`);
      const clocks = msp430Clocks(first.io, defineValue(textOf(input, "src/timing.h"), "TIMING_CLOCK_HZ"));
      problems.push(...clocks.problems);
      const tassel = (s0.tactl >> 8) & 3;
      const id = 2 ** ((s0.tactl >> 6) & 3);
      const mc = (s0.tactl >> 4) & 3;
      const onAclk = tassel === 1;
      const fTimer = tassel === 2 ? clocks.smclkHz : onAclk ? clocks.aclkHz : null;
      const from = tassel === 2 ? `SMCLK from the ${clocks.smclkFrom}` : `ACLK from the ${clocks.aclkFrom}`;
      if (mc !== 1)
        return differsWithout(
          `Timer_A is not in up mode (MC = ${mc}): ${[...problems, "the timer does not run as planned"].join("; ")}.`,
          tool,
        );
      if (fTimer === null)
        return differsWithout(
          `The timer clock is unknown (TASSEL ${tassel}, ${from}): ${problems.join("; ") || "no calibrated source"}.`,
          tool,
        );
      const perTick = id * (onAclk ? SIM_SMCLK_PER_ACLK : 1); // simulator steps per timer count
      const counts = s0.ccr[0] + 1; // SLAU144 up mode: 0..TACCR0
      const p1dir = lastWrite(first.io, MSP430_REG.P1DIR) ?? 0;
      const p1sel = lastWrite(first.io, MSP430_REG.P1SEL) ?? 0;
      const mask = 1 << bit;
      if ((p1dir & mask) === 0) problems.push(`${input.planned.pin} is not an output (P1DIR)`);
      const pwm = (s0.cctl[1] & 0xe0) === 0xe0 && (p1sel & mask) !== 0;
      const isr = (s0.cctl[0] & 0x10) !== 0 && (p1sel & mask) === 0;

      if (pwm) {
        // Samples a whole number of counts apart, not a divisor of the period, so wraps fall between them.
        const d = Math.floor(counts * 0.37) + 1;
        if (SETTLE_STEPS + 10 * d * perTick > MSP430_MAX_SIM_CYCLES)
          return notEmulated(
            `Sampling this PWM takes more than ${MSP430_MAX_SIM_CYCLES} simulated cycles; not run.`,
            tool,
          );
        const { samples } = await sampleTimerAsync(file, SETTLE_STEPS, d * perTick, 10, sim, left());
        const ns = periodsFromSamples(samples, id, onAclk);
        if (ns.length === 0)
          return differsWithout(
            `Timer_A never wrapped in the simulator: ${[...problems, "no output"].join("; ")}.`,
            tool,
          );
        if (ns.some((n) => n !== ns[0]))
          problems.push(`the counter period changes: ${[...new Set(ns)].join(", ")} counts`);
        const countS = id / fTimer;
        const periodS = ns[0] * countS;
        const highS = samples[samples.length - 1].ccr[1] * countS; // OUTMOD_7 reset/set: high for TACCR1 counts
        const edges = [0, 1, 2].flatMap((k) => [
          { t: k * periodS, level: 1 as const },
          { t: k * periodS + highS, level: 0 as const },
        ]);
        const last = samples[samples.length - 1];
        const emulatedS =
          (onAclk ? last.aclk : last.smclk) / (onAclk ? (clocks.aclkHz ?? 1) : (clocks.smclkHz ?? 1));
        const basis =
          `mspdebug's simulator ran the image; its Timer_A has no output unit, so the period is the counter's wrap seen in ` +
          `${samples.length} TAR samples (${ns[0]} counts of ${id}/${fTimer} s, ${from}) and the high time TACCR1 = ` +
          `${last.ccr[1]} counts (OUTMOD_7); edges count from a counter wrap`;
        return verdict(input, { periodS, highS, edges, emulatedS }, basis, tool, problems);
      }
      if (!isr)
        return differsWithout(
          `Timer_A drives neither TA0.1 PWM nor a CCR0 interrupt for ${input.planned.pin}: ${[...problems, `TACCTL0 ${s0.cctl[0]}, TACCTL1 ${s0.cctl[1]}`].join("; ")}.`,
          tool,
        );
      const intervalS = (id * counts) / fTimer;
      const divider = Math.max(1, Math.round(input.planned.periodS / intervalS));
      // One whole output period and a margin: rise, fall and the next rise are all seen.
      const stops = divider + 3;
      const look = Math.ceil(2.5 * counts * perTick);
      const cycles = SETTLE_STEPS + look + (stops + 1) * counts * perTick;
      if (cycles > MSP430_MAX_SIM_CYCLES)
        return notEmulated(
          `The interrupt plan needs about ${cycles} simulated cycles for two periods; the wrapper's budget is ${MSP430_MAX_SIM_CYCLES}, so it was not run.`,
          tool,
        );
      // Bounded look first: a run to a breakpoint that never comes would only end at the time cap.
      const pre = await countEventsAsync(file, SETTLE_STEPS + look, CCR0_SLOT, sim, left());
      if (pre.irqs < 2)
        return differsWithout(
          `Only ${pre.irqs} timer interrupts in two and a half planned intervals: ${[...problems, "no output"].join("; ")}.`,
          tool,
        );
      const { stops: seen } = await runToBreaksAsync(file, "timing_isr", "reset_entry", stops, sim, left());
      if (seen.length < stops)
        return differsWithout(`The handler was reached ${seen.length} of ${stops} times.`, tool);
      const rate = onAclk ? (clocks.aclkHz as number) : (clocks.smclkHz as number);
      const t = seen.map((x) => (onAclk ? x.aclk : x.smclk) / rate);
      // The level handler i writes shows as a P1 change before stop i+1 ("---- -H--": bits 7..0).
      let cur: 0 | 1 = 0;
      const levels = seen.slice(1).map((x) => {
        const change = x.p1Changes[x.p1Changes.length - 1];
        const c = change?.replace(" ", "")[7 - bit];
        if (c === "H") cur = 1;
        else if (c === "l" || c === "L") cur = 0;
        return cur;
      });
      const edges: { t: number; level: 0 | 1 }[] = [];
      let prev: 0 | 1 = 0;
      levels.forEach((l, i) => {
        if (l !== prev) edges.push({ t: t[i], level: l });
        prev = l;
      });
      const rises = edges.filter((e) => e.level === 1);
      const fall = edges.find((e) => e.level === 0 && rises.length > 0 && e.t > rises[0].t);
      if (rises.length < 2 || !fall)
        return differsWithout(
          `${input.planned.pin} rose ${rises.length} times in ${stops} interrupts: ${[...problems, "no repeating output"].join("; ")}.`,
          tool,
          t[t.length - 1],
        );
      const basis =
        `mspdebug's simulator ran the image for ${stops} CCR0 interrupts (every ${id}*${counts} counts of ${from}); ` +
        `the edges are the simulated times of the handler calls that changed ${input.planned.pin} (no Timer_A output unit is needed)`;
      return verdict(
        input,
        {
          periodS: rises[1].t - rises[0].t,
          highS: fall.t - rises[0].t,
          edges: edges.slice(0, 8),
          emulatedS: t[t.length - 1],
        },
        basis,
        tool,
        problems,
      );
    } catch (e) {
      if (e instanceof SimFailure)
        return notEmulated(`The simulator run did not finish: ${e.message}.`, tool);
      throw e;
    }
  });
};

/** A triggered or zero-cross image with P1.x driven by the simulator's gpio device. */
async function emulateTriggered(
  input: EmulationInput,
  elf: Uint8Array | string,
  bit: number,
  tool: string,
  left: () => number,
): Promise<EmulationResult> {
  const inPin = /^P1\.([0-7])$/.exec(input.trigger?.input ?? "");
  if (!inPin) return notEmulated(`The ${input.kind} plan names no P1 input pin to drive.`, tool);
  const clockHz = input.clockHz ?? 0;
  if (!(clockHz > 0)) return notEmulated("No CPU clock given for the simulator run.", tool);
  const budgetS = MSP430_MAX_SIM_CYCLES / clockHz;
  const drive = driveSchedule(input, 0, budgetS);
  if (!("halfS" in drive)) return { ...drive, tool };
  const pin = Number(inPin[1]);
  const halfSteps = Math.round((drive.halfS * clockHz) / 2);
  const n = Math.floor((drive.lengthS - drive.firstS) / drive.halfS) + 1;
  // Idle high (the pull-up) from the first step, before the image enables the port interrupt.
  const changes: InputChange[] = [{ steps: 1, pin, level: 1 }];
  for (let k = 0; k < n; k++)
    changes.push({ steps: k === 0 ? TRIGGER_SETTLE_STEPS : halfSteps, pin, level: k % 2 === 0 ? 0 : 1 });
  const tail = Math.round(((drive.lengthS - drive.firstS - (n - 1) * drive.halfS) * clockHz) / 2);
  return withTempFiles({ "firmware.elf": elf }, async (dir) => {
    try {
      const r = await runWithInputsAsync(
        `${dir}/firmware.elf`,
        changes,
        Math.max(tail, 1),
        { calibration: true, watchdog: true, p1Irq: PORT1_SLOT },
        left(),
      );
      const clocks = msp430Clocks(r.io, defineValue(textOf(input, "src/timing.h"), "TIMING_CLOCK_HZ"));
      const hz = clocks.smclkHz;
      if (!hz)
        return differsWithout(
          `The image's clock set-up gives no known clock: ${clocks.problems.join("; ")}.`,
          tool,
        );
      const ins = r.changeAt.slice(1).map((at, k) => ({ t: at / hz, level: (k % 2 === 0 ? 0 : 1) as 0 | 1 }));
      const mask = 1 << bit;
      const outs = r.io
        .filter((w) => w.addr === P1OUT && w.width === "b")
        .map((w) => ({ t: w.at / hz, level: (w.value & mask ? 1 : 0) as 0 | 1 }));
      const endS = Math.max(ins[ins.length - 1]?.t ?? 0, outs[outs.length - 1]?.t ?? 0) + tail * (2 / hz);
      const schedule: DriveSchedule = { ...drive, firstS: ins[0]?.t ?? 0 };
      const j = judgeTriggered(input, ins, outs, { tool, emulatedS: endS, stepS: 1 / hz, schedule });
      return {
        ...j,
        reason: `${j.reason} mspdebug's gpio drove ${input.trigger!.input}; SMCLK from the ${clocks.smclkFrom}.`,
      };
    } catch (e) {
      if (e instanceof SimFailure)
        return notEmulated(`The simulator run did not finish: ${e.message}.`, tool);
      throw e;
    }
  });
}
