// Judges one emulated STM32G031 run against the plan it was built from and
// the request the user made. Returns every problem found, in plain words; an
// empty list means the image does what the plan promises. Expected facts come
// from the documents named beside them, never from the engine.
import type { TimerPlan } from "@/lib/engine";
import type { Stm32Run } from "./stm32g031-run";

/** Timer channel 1 pins and alternate functions: ST's pin data for the STM32G031 (alternate function table). */
export const DATASHEET_CH1_PIN = {
  TIM2: { port: "A", bit: 0, af: 2 },
  TIM3: { port: "A", bit: 6, af: 1 },
} as const;

/** Interrupt numbers: RM0444 interrupt and exception vectors (TIM2 = 15, TIM3 = 16). */
export const DATASHEET_IRQ = { TIM2: 15, TIM3: 16 } as const;

/** RCC_APBENR1 enable bits: RM0444 RCC_APBENR1 (TIM2EN bit 0, TIM3EN bit 1); RCC_IOPENR GPIOAEN bit 0. */
const APBENR1_BIT = { TIM2: 0, TIM3: 1 } as const;

export interface Request {
  periodS: number;
  highS: number;
}

/** Timer kernel clock from SYSCLK and RCC_CFGR HPRE/PPRE (RM0444 clock tree: x2 when the APB prescaler is not 1). */
export function timerClockHz(sysclkHz: number, cfgr: number): number {
  const hpre = (cfgr >> 8) & 0xf;
  const ppre = (cfgr >> 12) & 7;
  const hclk = sysclkHz / (hpre < 8 ? 1 : 2 ** (hpre - 7));
  const pclk = hclk / (ppre < 4 ? 1 : 2 ** (ppre - 3));
  return ppre < 4 ? pclk : 2 * pclk;
}

/** Smallest repeat length of a level sequence and the high entries in one repeat. */
export function levelPeriod(levels: number[]): { period: number; high: number } | null {
  for (let p = 1; p <= levels.length / 2; p++) {
    if (levels.every((v, i) => i + p >= levels.length || v === levels[i + p])) {
      return { period: p, high: levels.slice(0, p).filter((v) => v === 1).length };
    }
  }
  return null;
}

const near = (a: number, b: number, tol: number) => Math.abs(a - b) <= tol;

/**
 * Problems of the run up to the idle loop that do not depend on the plan:
 * the harness's faults, a wait that never ends, and clock enables after the
 * first access of the timer or of the pin's GPIO port. `stop` is true when the
 * image never reached its idle loop (nothing after it can be judged).
 */
export function startupProblems(run: Stm32Run, t: "TIM2" | "TIM3"): { problems: string[]; stop: boolean } {
  const problems: string[] = [];
  if (run.error) problems.push(run.error);
  if (!run.idle) {
    const s = run.stuck;
    problems.push(
      `did not reach its idle loop in ${run.steps} instructions` +
        (s
          ? `: kept reading ${s.polled} (${s.reads} times)${s.pending.length ? "; " + s.pending.join("; ") : ""}`
          : ""),
    );
    return { problems, stop: true };
  }
  problems.push(...run.faults);
  const pin = DATASHEET_CH1_PIN[t];
  // Clock enables come before the first access of the block (RM0444 RCC: a block without its clock ignores writes).
  const firstTimer = run.writes.findIndex(([n]) => n.startsWith(`${t}_`));
  const timerEnable = run.writes.findIndex(
    ([n, v]) => n === "RCC_APBENR1" && (v & (1 << APBENR1_BIT[t])) !== 0,
  );
  if (firstTimer < 0) problems.push(`${t} was never written`);
  else if (timerEnable < 0 || timerEnable > firstTimer)
    problems.push(`${t} written before RCC_APBENR1 ${t}EN`);
  const firstGpio = run.writes.findIndex(([n]) => n.startsWith(`GPIO${pin.port}_`));
  const gpioEnable = run.writes.findIndex(([n, v]) => n === "RCC_IOPENR" && (v & 1) !== 0);
  if (firstGpio < 0) problems.push(`GPIO${pin.port} was never written`);
  else if (gpioEnable < 0 || gpioEnable > firstGpio)
    problems.push(`GPIO${pin.port} written before RCC_IOPENR`);
  return { problems, stop: false };
}

export function judgeStm32(run: Stm32Run, plan: TimerPlan, request: Request): string[] {
  const t = plan.timer as "TIM2" | "TIM3";
  const pin = DATASHEET_CH1_PIN[t];
  if (!pin) return [`unexpected timer ${plan.timer}`];
  const { problems, stop } = startupProblems(run, t);
  if (stop) return problems;

  if (run.sysclkHz !== plan.clockHz)
    problems.push(`SYSCLK is ${run.sysclkHz} Hz, the plan assumes ${plan.clockHz} Hz`);
  const fTim = timerClockHz(run.sysclkHz ?? 0, run.rcc.CFGR);
  const r = run.timers[t];
  const gpio = run.gpio[pin.port];
  const moder = (gpio.MODER >> (2 * pin.bit)) & 3;
  const afr = ((pin.bit < 8 ? gpio.AFRL : gpio.AFRH) >> (4 * (pin.bit % 8))) & 0xf;
  if ((r.CR1 & 1) === 0) problems.push(`${t}_CR1.CEN is 0: the counter does not run`);

  const count = (r.PSC + 1) / fTim; // one counter step (RM0444: f_CK_CNT = f_TIM / (PSC + 1))
  let periodS: number;
  let highS: number;
  if (plan.mode === "isr") {
    if (moder !== 1) problems.push(`P${pin.port}${pin.bit} MODER is ${moder}, not 01 (output)`);
    if ((r.DIER & 1) === 0) problems.push(`${t}_DIER.UIE is 0`);
    if ((run.nvicIser & (1 << DATASHEET_IRQ[t])) === 0)
      problems.push(`NVIC IRQ ${DATASHEET_IRQ[t]} (${t}) not enabled`);
    const interval = (r.ARR + 1) * count;
    const levels = run.isrCalls.map((c) => c.level);
    if (run.isrCalls.some((c) => !c.uifCleared)) problems.push("the handler left UIF set");
    const lp = levelPeriod(levels);
    if (!lp || lp.high === 0 || lp.high === lp.period) {
      problems.push(`the pin does not alternate over ${levels.length} interrupts: ${levels.join("")}`);
      return problems;
    }
    if (lp.period !== plan.softwareDivider)
      problems.push(`pin repeats every ${lp.period} interrupts, plan says ${plan.softwareDivider}`);
    if (lp.high !== plan.highCounts)
      problems.push(`pin high for ${lp.high} interrupts, plan says ${plan.highCounts}`);
    if (
      plan.interruptIntervalS !== null &&
      !near(interval, plan.interruptIntervalS, plan.interruptIntervalS * 1e-9)
    )
      problems.push(`interrupt every ${interval} s, plan.json says ${plan.interruptIntervalS} s`);
    periodS = lp.period * interval;
    highS = lp.high * interval;
    // Half a count per interrupt for the period; the high time steps in whole interrupts.
    if (!near(periodS, request.periodS, 0.5 * count * lp.period + 1e-15))
      problems.push(`period ${periodS} s, requested ${request.periodS} s`);
    if (!near(highS, request.highS, 0.5 * interval + 0.5 * count * lp.high + 1e-15))
      problems.push(`high time ${highS} s, requested ${request.highS} s`);
  } else {
    if (moder !== 2) problems.push(`P${pin.port}${pin.bit} MODER is ${moder}, not 10 (alternate function)`);
    if (afr !== pin.af)
      problems.push(`P${pin.port}${pin.bit} AFR is AF${afr}, the datasheet's ${t}_CH1 is AF${pin.af}`);
    if ((r.CCER & 1) === 0) problems.push(`${t}_CCER.CC1E is 0: no output`);
    if ((r.CCER & 2) !== 0) problems.push(`${t}_CCER.CC1P is 1: inverted output`);
    const oc1m = (r.CCMR1 >> 4) & 7;
    if (plan.mode === "pwm") {
      if (oc1m !== 6) problems.push(`${t}_CCMR1.OC1M is ${oc1m}, not 110 (PWM mode 1)`);
      // PWM mode 1, upcounting: OC1REF high while CNT < CCR1 (RM0444, PWM mode).
      periodS = (r.ARR + 1) * count;
      highS = Math.min(r.CCR1, r.ARR + 1) * count;
    } else {
      if (oc1m !== 3) problems.push(`${t}_CCMR1.OC1M is ${oc1m}, not 011 (toggle)`);
      // Toggle on match: one output period is two update periods (RM0444, output compare mode).
      periodS = 2 * (r.ARR + 1) * count;
      highS = periodS / 2;
    }
    if (!near(periodS, request.periodS, 0.5 * count * (plan.mode === "toggle" ? 2 : 1) + 1e-15))
      problems.push(`period ${periodS} s, requested ${request.periodS} s (more than half a count apart)`);
    if (!near(highS, request.highS, 0.5 * count + 1e-15))
      problems.push(`high time ${highS} s, requested ${request.highS} s (more than half a count apart)`);
  }
  const rel = 1e-9;
  if (!near(periodS, plan.periodS, plan.periodS * rel))
    problems.push(`period ${periodS} s, plan.json says ${plan.periodS} s`);
  if (!near(highS, plan.highS, plan.highS * rel))
    problems.push(`high time ${highS} s, plan.json says ${plan.highS} s`);

  // plan.json's register values are the ones the firmware leaves in the timer (EGR is write-only: look in the log).
  for (const [key, value] of Object.entries(plan.registers)) {
    if (key === "EGR") {
      if (!run.writes.some(([n, v]) => n === `${t}_EGR` && v === value))
        problems.push(`${t}_EGR = ${value} never written`);
    } else if (r[key] !== value) {
      problems.push(`${t}_${key} is ${r[key]}, plan.json says ${value}`);
    }
  }
  return problems;
}
