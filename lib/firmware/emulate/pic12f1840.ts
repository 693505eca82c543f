// PIC12F1840 emulator wrapper: runs the target's firmware.hex in gpsim (Debian
// gpsim, processor p12f1840; harness/gpsim.ts). gpsim drives CCP1's PWM onto
// RA2, so PWM plans are measured from the pin's edges, sampled once per
// instruction; interrupt plans from the cycles at which the Timer2 handler
// writes LATA. gpsim counts instruction cycles (Fosc/4) and does not derive
// time from OSCCON, so the clock is decoded from the image's configuration
// words and the OSCCON it runs with (DS40001441 Registers 4-1, 4-2, 5-1);
// a crystal's frequency is a board fact the bundle states in src/timing.h.
// Triggered and zero-cross plans: a gpsim stimulus drives the input pin (RA1)
// as judge-trigger.ts schedules it (idle high from the first cycle) and the
// pulses are the handler's LATA writes, one instruction cycle of resolution.
// Server-only.
import { driveSchedule, inputChanges, judgeTriggered } from "./judge-trigger";
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
import {
  GpsimFailure,
  configWords,
  gpsimVersion,
  latchWritesAsync,
  pinStimulus,
  pinTiming,
  registersAtAsync,
  tracePinAsync,
} from "./harness/gpsim";
import { decodeConfig2, systemClockHz } from "./harness/pic12f1840-tables";

const KINDS = ["periodic", "triggered", "zero-cross"] as const;
/** Time the image is given to start (crystal start-up, set-up) before the first input change. */
const TRIGGER_START_UP_S = 5e-3;
/** Instruction cycles before the set-up is read: past the oscillator wait and Timer2's first period. */
const SETTLE_CYCLES = 20_000;
/** Pin samples (one `step` each) a PWM trace may take. */
export const PIC_MAX_STEPS = 12_000;
/** Instruction cycles an interrupt plan may run. */
export const PIC_MAX_CYCLES = 4_000_000;
/** The image this wrapper runs, inside the target folder (index.ts names it in the stored result). */
export const PIC12F1840_IMAGE = "firmware/firmware.hex";
const IMAGE = "firmware.hex";

export const emulatePic12f1840: DeviceEmulator = async (input: EmulationInput): Promise<EmulationResult> => {
  const refused = commonRefusal(input, "PIC12F1840", KINDS);
  if (refused) return refused;
  const hex = fileOf(input, PIC12F1840_IMAGE);
  if (hex === null) return notEmulated(`The target has no ${input.folder}/${PIC12F1840_IMAGE} image to run.`);
  const pin = /^RA([0-5])$/.exec(input.planned.pin);
  if (!pin) return notEmulated(`Output pin ${input.planned.pin} is not a PORTA pin of the PIC12F1840.`);
  const bit = Number(pin[1]);
  const tool = await gpsimVersion();
  if (!tool)
    return notEmulated("gpsim is not installed on this deployment (Debian package gpsim); nothing was run.");
  const timeoutMs = input.timeoutMs ?? 10_000;
  const started = Date.now();
  const left = () => Math.max(1, timeoutMs - (Date.now() - started));

  return withTempFiles({ [IMAGE]: hex }, async (dir) => {
    try {
      const regs = await registersAtAsync(
        dir,
        SETTLE_CYCLES,
        ["OSCCON", "T2CON", "PR2", "CCP1CON"],
        IMAGE,
        left(),
      );
      const { config1, config2 } = configWords(`${dir}/${IMAGE}`);
      const board = defineValue(textOf(input, "src/timing.h"), "_XTAL_FREQ") ?? 0;
      const hz = systemClockHz(config1, config2, regs.OSCCON, board);
      // gpsim 0.31 never sets MFIOFR or PLLR (OSCSTAT reads 0x39): an image waiting for them never starts there.
      const ircf = (regs.OSCCON >> 3) & 15;
      if (ircf >= 2 && ircf <= 4)
        return notEmulated(
          "This image runs from MFINTOSC (62.5 or 31.25 kHz); gpsim 0.31 never reports it ready, so nothing was measured.",
          tool,
        );
      if ((regs.OSCCON & 0x80) !== 0 || decodeConfig2(config2).pllen)
        return notEmulated(
          "This image runs through the 4x PLL; gpsim 0.31 never reports PLLR, so nothing was measured.",
          tool,
        );
      if (!(hz > 0)) return differsWithout("The image's oscillator set-up gives no known clock.", tool);
      const tcy = 4 / hz;
      const clock = `${hz} Hz from CONFIG1 0x${config1.toString(16)} and OSCCON 0x${regs.OSCCON.toString(16)}`;
      if (input.kind !== "periodic") {
        // Timer2 rests until the first edge starts it, so its run bit is not checked here.
        const inPin = input.trigger?.input ?? "";
        if (!/^RA[0-5]$/.test(inPin))
          return notEmulated(`The ${input.kind} plan names no PORTA input pin to drive.`, tool);
        const drive = driveSchedule(input, Math.max(TRIGGER_START_UP_S, 2000 * tcy), PIC_MAX_CYCLES * tcy);
        if (!("halfS" in drive)) return { ...drive, tool };
        const ins = inputChanges(drive).map((e) => ({ cycle: Math.round(e.t / tcy), level: e.level }));
        const cycles = Math.ceil(drive.lengthS / tcy);
        // Idle high (the pull-up) from cycle 1, before the image enables interrupt-on-change.
        const stim = pinStimulus(inPin, [{ cycle: 1, level: 1 }, ...ins]);
        const writes = await latchWritesAsync(dir, cycles, IMAGE, left(), stim);
        const mask = 1 << bit;
        const outs = writes.map((w) => ({ t: w.cycle * tcy, level: (w.value & mask ? 1 : 0) as 0 | 1 }));
        const r = judgeTriggered(
          input,
          ins.map((e) => ({ t: e.cycle * tcy, level: e.level })),
          outs,
          { tool, emulatedS: cycles * tcy, stepS: tcy, schedule: drive },
        );
        return { ...r, reason: `${r.reason} gpsim drove ${inPin}; clock ${clock}.` };
      }
      if ((regs.T2CON & 4) === 0)
        return differsWithout(
          `Timer2 is not running (T2CON 0x${regs.T2CON.toString(16)}, TMR2ON = 0): no output.`,
          tool,
        );

      if ((regs.CCP1CON & 0x0c) === 0x0c) {
        // CCP1 in PWM mode (CCP1M = 11xx, DS40001441 CCP chapter): sample the pin itself.
        const periodCycles = input.planned.periodS / tcy;
        const periods = Math.max(3, Math.min(12, Math.floor(8000 / periodCycles)));
        const steps = Math.ceil(((periods + 1) * periodCycles) / 2);
        if (steps > PIC_MAX_STEPS)
          return notEmulated(
            `Tracing this PWM takes ${steps} pin samples; the wrapper's budget is ${PIC_MAX_STEPS}.`,
            tool,
          );
        const from = SETTLE_CYCLES;
        const samples = await tracePinAsync(dir, bit, from, steps, IMAGE, left());
        const t = pinTiming(samples);
        const end = samples[samples.length - 1].cycle;
        if (!t)
          return differsWithout(
            `${input.planned.pin} did not toggle in ${end} instruction cycles: no PWM.`,
            tool,
            end * tcy,
          );
        const edges: { t: number; level: 0 | 1 }[] = [];
        for (let i = 1; i < samples.length && edges.length < 8; i++)
          if (samples[i].level !== samples[i - 1].level)
            edges.push({ t: samples[i].cycle * tcy, level: samples[i].level });
        const basis =
          `gpsim ran the image and ${input.planned.pin} was sampled after each of ${steps} instructions from cycle ${from} ` +
          `(mean over ${t.periods} periods; one instruction is at most two cycles); clock ${clock}`;
        return verdict(
          input,
          { periodS: t.periodCycles * tcy, highS: t.highCycles * tcy, edges, emulatedS: end * tcy },
          basis,
          tool,
          [],
        );
      }
      // Interrupt plan: the Timer2 handler writes LATA once per interrupt (DS40001441 Timer2: period (PR2+1)*prescale*postscale).
      const prescale = [1, 4, 16, 64][regs.T2CON & 3];
      const postscale = ((regs.T2CON >> 3) & 15) + 1;
      const intervalCycles = (regs.PR2 + 1) * prescale * postscale;
      const divider = Math.max(1, Math.round(input.planned.periodS / (intervalCycles * tcy)));
      const cycles = Math.round(intervalCycles * (divider + 4)) + SETTLE_CYCLES;
      if (cycles > PIC_MAX_CYCLES)
        return notEmulated(
          `The interrupt plan needs ${cycles} instruction cycles for one period; the wrapper's budget is ${PIC_MAX_CYCLES}.`,
          tool,
        );
      const writes = (await latchWritesAsync(dir, cycles, IMAGE, left())).slice(1); // the first is the start-up clear
      const mask = 1 << bit;
      const edges: { t: number; level: 0 | 1 }[] = [];
      let prev: 0 | 1 = 0;
      for (const w of writes) {
        const l = (w.value & mask) !== 0 ? 1 : 0;
        if (l !== prev) edges.push({ t: w.cycle * tcy, level: l });
        prev = l;
      }
      const rises = edges.filter((e) => e.level === 1);
      const fall = edges.find((e) => e.level === 0 && rises.length > 0 && e.t > rises[0].t);
      if (rises.length < 2 || !fall)
        return differsWithout(
          `${input.planned.pin} rose ${rises.length} times in ${cycles} instruction cycles (${writes.length} LATA writes by the handler): no repeating output.`,
          tool,
          cycles * tcy,
        );
      const basis =
        `gpsim ran the image for ${cycles} instruction cycles and logged every LATA write; the edges are the cycles at which ` +
        `the Timer2 handler changed ${input.planned.pin} (an interrupt every ${intervalCycles} cycles); clock ${clock}`;
      return verdict(
        input,
        {
          periodS: rises[1].t - rises[0].t,
          highS: fall.t - rises[0].t,
          edges: edges.slice(0, 8),
          emulatedS: cycles * tcy,
        },
        basis,
        tool,
        [],
      );
    } catch (e) {
      if (e instanceof GpsimFailure) return notEmulated(`The gpsim run did not finish: ${e.message}.`, tool);
      throw e;
    }
  });
};
