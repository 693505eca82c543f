// STM32G031 emulator wrapper: runs the target's firmware.elf from reset to its
// idle loop in our python3-unicorn harness (harness/stm32g031-emu.py, Debian
// python3-unicorn under /usr/bin/python3). The harness has no counting timer
// and no output unit, so the period and high time come from the clock tree
// and timer registers the image leaves (RM0444 formulas); an interrupt plan's
// come from the pin levels its handler writes when called as the NVIC would.
// The reason says which.
// Triggered and zero-cross plans (RM0444 EXTI, one-pulse mode): the harness
// raises the EXTI line for each input change judge-trigger.ts schedules, as
// the EXTI would (pending only for a selected edge, the handler called
// through the vector table when unmasked) and counts the handler's cycles to
// its TIMx_CR1 store. The pulse is computed from there: on CCR1 counts after
// CEN (PWM mode 2), off at the update (ARR + 1 counts), a count being
// (PSC + 1) timer clocks. Exception entry is not emulated (the plan's stated
// latency covers it). Server-only: runs a Debian tool.
import { driveSchedule, inputChanges, judgeTriggered } from "./judge-trigger";
import { MAX_EMULATED_S } from "./switches";
import type { DeviceEmulator, EmulationInput, EmulationResult } from "./types";
import {
  commonRefusal,
  defineValue,
  differsWithout,
  fileOf,
  notEmulated,
  outputPackage,
  textOf,
  verdict,
  withTempFiles,
} from "./harness/common";
import { DATASHEET_CH1_PIN, DATASHEET_IRQ, startupProblems, timerClockHz } from "./harness/stm32g031-judge";
import { interruptOutput, registerOutput, stm32Setup, timerForPin } from "./harness/stm32g031-output";
import {
  harnessPython,
  runStm32Harness,
  unicornVersion,
  type RunOptions,
  type Stm32Run,
} from "./harness/stm32g031-run";

/** Instructions from reset to the idle loop; generated start-up code needs a few hundred. */
export const STM32_MAX_INSTRUCTIONS = 200_000;
/** Handler calls for an interrupt plan: two whole output periods and one more call. */
export const STM32_MAX_ISR_CALLS = 4001;
/** The image this wrapper runs, inside the target folder (index.ts names it in the stored result). */
export const STM32G031_IMAGE = "firmware/firmware.elf";
const KINDS = ["periodic", "triggered", "zero-cross"] as const;
/** EXTI lines to their shared vector (RM0444 vector table: EXTI0_1 = 5, EXTI2_3 = 6, EXTI4_15 = 7). */
const extiIrqOf = (line: number) => (line <= 1 ? 5 : line <= 3 ? 6 : 7);

export const emulateStm32g031: DeviceEmulator = async (input: EmulationInput): Promise<EmulationResult> => {
  const refused = commonRefusal(input, "STM32G031", KINDS);
  if (refused) return refused;
  const elf = fileOf(input, STM32G031_IMAGE);
  if (elf === null) return notEmulated(`The target has no ${input.folder}/${STM32G031_IMAGE} image to run.`);
  const t = timerForPin(input.planned.pin);
  if (!t)
    return notEmulated(
      `Output pin ${input.planned.pin} is not a timer channel 1 pin the STM32G031 wrapper knows (PA0 TIM2_CH1, PA6 TIM3_CH1).`,
    );
  const tool = await unicornVersion();
  if (!tool)
    return notEmulated(
      `python3-unicorn is not installed for ${harnessPython()} on this deployment (Debian package python3-unicorn); nothing was run.`,
    );
  const timeoutMs = input.timeoutMs ?? 10_000;
  const started = Date.now();
  const left = () => Math.max(1, timeoutMs - (Date.now() - started));

  return withTempFiles({ "firmware.elf": elf }, async (dir) => {
    const base: RunOptions = { maxInstructions: STM32_MAX_INSTRUCTIONS };
    const pkg = outputPackage(input);
    if (pkg) base.package = pkg;
    // The board's clock on PC14-OSC_IN: only an HSE-bypass plan uses it (timing.h states SYSCLK = that clock).
    const ext = defineValue(textOf(input, "src/timing.h"), "SYSCLK_HZ");
    if (ext && /ext-clock/.test(textOf(input, "src/main.c") ?? "")) base.extClockHz = ext;
    const first = await runStm32Harness(`${dir}/firmware.elf`, base, left());
    if ("failure" in first) return notEmulated(`The emulator run did not finish: ${first.failure}.`, tool);
    const run = first.run;
    if (input.kind !== "periodic") return triggered(input, t, run, `${dir}/firmware.elf`, base, tool, left);
    const setup = stm32Setup(run, t);
    if (setup.stop || setup.mode === null)
      return differsWithout(
        `The image does not drive ${input.planned.pin} from ${t}: ${setup.problems.join("; ")}.`,
        tool,
      );
    if (setup.mode !== "isr") {
      const out = registerOutput(run, t, setup.mode, setup);
      const basis =
        `unicorn ran the image from reset to its idle loop (${run.steps} instructions); it has no counting timer or ` +
        `output unit, so the output is computed from the clock tree (SYSCLK ${run.sysclkHz} Hz) and ${t}'s registers ` +
        `(${setup.mode === "pwm" ? "PWM mode 1" : "toggle on match"}, PSC ${run.timers[t].PSC}, ARR ${run.timers[t].ARR}, CCR1 ${run.timers[t].CCR1}); edges count from the counter start`;
      return verdict(input, { ...out, emulatedS: out.coveredS }, basis, tool, setup.problems);
    }
    // Interrupt plan: enough handler calls for two output periods of the plan.
    const divider = Math.max(1, Math.round(input.planned.periodS / setup.updateS));
    const calls = 2 * divider + 1;
    if (calls > STM32_MAX_ISR_CALLS)
      return notEmulated(
        `The interrupt plan needs ${calls} handler calls for two periods (an update every ${setup.updateS} s); the wrapper's budget is ${STM32_MAX_ISR_CALLS}, so it was not run.`,
        tool,
      );
    const pin = DATASHEET_CH1_PIN[t];
    const second = await runStm32Harness(
      `${dir}/firmware.elf`,
      { ...base, isrIrq: DATASHEET_IRQ[t], isrCalls: calls, pinPort: pin.port, pinBit: pin.bit },
      left(),
    );
    if ("failure" in second) return notEmulated(`The emulator run did not finish: ${second.failure}.`, tool);
    const initial = ((run.gpio[pin.port].ODR >> pin.bit) & 1) as 0 | 1;
    const out = interruptOutput(second.run, t, initial, setup);
    if (typeof out === "string") return differsWithout(`${out}.`, tool, calls * setup.updateS);
    const basis =
      `unicorn ran the image to its idle loop, then called ${t}'s handler ${calls} times through the vector table as the ` +
      `NVIC would, one call per update (every ${setup.updateS} s from SYSCLK ${run.sysclkHz} Hz, PSC ${run.timers[t].PSC}, ` +
      `ARR ${run.timers[t].ARR}; no counting timer in the emulator); the output is the pin level after each call`;
    return verdict(input, { ...out, emulatedS: out.coveredS }, basis, tool, [
      ...setup.problems,
      ...out.problems,
    ]);
  });
};

/** Set-up a one-pulse trigger image must leave (RM0444 general-purpose timer, GPIO and EXTI chapters). */
function triggerSetupProblems(run: Stm32Run, t: "TIM2" | "TIM3", line: number, edge: string): string[] {
  const p = [...startupProblems(run, t).problems];
  const r = run.timers[t];
  const pin = DATASHEET_CH1_PIN[t];
  const g = run.gpio[pin.port];
  const afr = ((pin.bit < 8 ? g.AFRL : g.AFRH) >> (4 * (pin.bit % 8))) & 0xf;
  if (((g.MODER >> (2 * pin.bit)) & 3) !== 2 || afr !== pin.af)
    p.push(`P${pin.port}${pin.bit} is not AF${pin.af} (${t}_CH1)`);
  if (((r.CCMR1 >> 4) & 7) !== 7) p.push(`${t}_CCMR1.OC1M is ${(r.CCMR1 >> 4) & 7}, not PWM mode 2 (111)`);
  if ((r.CCER & 1) === 0) p.push(`${t}_CCER.CC1E is 0: no output`);
  if ((r.CR1 & 8) === 0) p.push(`${t}_CR1.OPM is 0: not one-pulse`);
  const e = run.exti;
  if (!e) return [...p, "the harness saw no EXTI set-up"];
  const bit = 1 << line;
  if (!!(e.RTSR1 & bit) !== (edge !== "falling"))
    p.push(`EXTI_RTSR1 bit ${line} does not match the ${edge} edge`);
  if (!!(e.FTSR1 & bit) !== (edge !== "rising"))
    p.push(`EXTI_FTSR1 bit ${line} does not match the ${edge} edge`);
  if (!(e.IMR1 & bit)) p.push(`EXTI_IMR1 bit ${line} is 0`);
  return p;
}

async function triggered(
  input: EmulationInput,
  t: "TIM2" | "TIM3",
  setupRun: Stm32Run,
  elf: string,
  base: RunOptions,
  tool: string,
  left: () => number,
): Promise<EmulationResult> {
  const m = /^PA(\d+)$/.exec(input.trigger?.input ?? "");
  if (!m) return notEmulated(`The ${input.kind} plan names no port A input to drive.`, tool);
  const line = Number(m[1]);
  const edge = input.trigger!.edge;
  const problems = triggerSetupProblems(setupRun, t, line, edge);
  if (setupRun.sysclkHz === null) return differsWithout("SYSCLK has no running source.", tool);
  const drive = driveSchedule(input, 1e-3, MAX_EMULATED_S);
  if (!("halfS" in drive)) return { ...drive, tool };
  const ins = inputChanges(drive);
  const r = await runStm32Harness(
    elf,
    {
      ...base,
      extiIrq: extiIrqOf(line),
      extiLine: line,
      edges: ins.map((e) => (e.level === 1 ? "rising" : "falling")),
    },
    left(),
  );
  if ("failure" in r) return notEmulated(`The emulator run did not finish: ${r.failure}.`, tool);
  const sysclk = setupRun.sysclkHz;
  const tim = r.run.timers[t];
  const countS = (tim.PSC + 1) / timerClockHz(sysclk, setupRun.rcc.CFGR);
  const outs: { t: number; level: 0 | 1 }[] = [];
  let busyUntil = -Infinity;
  (r.run.edgeCalls ?? []).forEach((c, i) => {
    if (!c.called) return;
    if (c.error) problems.push(`handler for input change ${i}: ${c.error}`);
    const store = c.writes?.find((w) => w[0] === `${t}_CR1`);
    if (!store || (c.timers[t].CR1 & 1) === 0) return;
    const startS = ins[i].t + (store[2] + 2) / sysclk; // the store ends 2 cycles after it starts (ARMv6-M)
    if (startS < busyUntil) return; // a run already counting: the pulse below still stands
    const on = startS + tim.CCR1 * countS;
    const off = startS + (tim.ARR + 1) * countS;
    outs.push({ t: on, level: 1 }, { t: off, level: 0 });
    busyUntil = off;
  });
  const j = judgeTriggered(input, ins, outs, {
    tool,
    emulatedS: drive.lengthS,
    stepS: 1 / sysclk,
    schedule: drive,
  });
  const basis = `unicorn raised EXTI${line} for each input change and ran the handler; no counting timer in the emulator, so each pulse is computed from the handler's ${t}_CR1 store and ${t}'s PSC ${tim.PSC}, CCR1 ${tim.CCR1}, ARR ${tim.ARR} (SYSCLK ${sysclk} Hz); exception entry not emulated`;
  if (problems.length > 0)
    return {
      ...j,
      verdict: "differs",
      reason: `Differs: ${problems.slice(0, 4).join("; ")}. ${j.reason} ${basis}.`,
    };
  return { ...j, reason: `${j.reason} ${basis}.` };
}
