// STM32G031 emulator wrapper: runs the target's firmware.elf from reset to its
// idle loop in our python3-unicorn harness (harness/stm32g031-emu.py, Debian
// python3-unicorn under /usr/bin/python3). The harness has no counting timer
// and no output unit, so the period and high time come from the clock tree
// and timer registers the image leaves (RM0444 formulas); an interrupt plan's
// come from the pin levels its handler writes when called as the NVIC would.
// The reason says which. Server-only: runs a Debian tool.
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
import { DATASHEET_CH1_PIN, DATASHEET_IRQ } from "./harness/stm32g031-judge";
import { interruptOutput, registerOutput, stm32Setup, timerForPin } from "./harness/stm32g031-output";
import { harnessPython, runStm32Harness, unicornVersion, type RunOptions } from "./harness/stm32g031-run";

/** Instructions from reset to the idle loop; generated start-up code needs a few hundred. */
export const STM32_MAX_INSTRUCTIONS = 200_000;
/** Handler calls for an interrupt plan: two whole output periods and one more call. */
export const STM32_MAX_ISR_CALLS = 4001;
/** The image this wrapper runs, inside the target folder (index.ts names it in the stored result). */
export const STM32G031_IMAGE = "firmware/firmware.elf";
const KINDS = ["periodic"] as const;

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
