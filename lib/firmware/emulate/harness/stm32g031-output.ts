// What an STM32G031 image puts on its output pin, worked out from an emulated
// run without the plan: the unicorn harness has no counting timer and no
// output unit, so the output follows from the clock tree and the timer
// registers the image leaves (RM0444 formulas), and for interrupt plans from
// the pin levels the handler writes when it is called as the NVIC would.
import {
  DATASHEET_CH1_PIN,
  DATASHEET_IRQ,
  levelPeriod,
  startupProblems,
  timerClockHz,
} from "./stm32g031-judge";
import type { Stm32Run } from "./stm32g031-run";

export type Stm32Timer = keyof typeof DATASHEET_CH1_PIN;
export type Stm32Mode = "pwm" | "toggle" | "isr";

/** The timer whose channel 1 the datasheet puts on this pin ("PA0" -> TIM2), or null. */
export function timerForPin(pin: string): Stm32Timer | null {
  for (const [t, p] of Object.entries(DATASHEET_CH1_PIN))
    if (pin.toUpperCase() === `P${p.port}${p.bit}`) return t as Stm32Timer;
  return null;
}

export interface Stm32Setup {
  problems: string[];
  /** Nothing after the start-up can be judged (the image never reached its idle loop). */
  stop: boolean;
  mode: Stm32Mode | null;
  /** One counter step and one update period of the timer, in seconds. */
  countS: number;
  updateS: number;
  sysclkHz: number | null;
}

/** Start-up, pin and timer set-up after the run to the idle loop, and the output mode they make. */
export function stm32Setup(run: Stm32Run, t: Stm32Timer): Stm32Setup {
  const { problems, stop } = startupProblems(run, t);
  const none = { problems, stop: true, mode: null, countS: 0, updateS: 0, sysclkHz: run.sysclkHz };
  if (stop) return none;
  if (run.sysclkHz === null) return { ...none, problems: [...problems, "SYSCLK has no running source"] };
  const pin = DATASHEET_CH1_PIN[t];
  const r = run.timers[t];
  const gpio = run.gpio[pin.port];
  const moder = (gpio.MODER >> (2 * pin.bit)) & 3;
  const afr = ((pin.bit < 8 ? gpio.AFRL : gpio.AFRH) >> (4 * (pin.bit % 8))) & 0xf;
  const name = `P${pin.port}${pin.bit}`;
  // RM0444: f_CK_CNT = f_TIM / (PSC + 1); an update every ARR + 1 counts.
  const countS = (r.PSC + 1) / timerClockHz(run.sysclkHz, run.rcc.CFGR);
  const updateS = (r.ARR + 1) * countS;
  if ((r.CR1 & 1) === 0) problems.push(`${t}_CR1.CEN is 0: the counter does not run`);
  const oc1m = (r.CCMR1 >> 4) & 7;
  let mode: Stm32Mode | null = null;
  if (moder === 2) {
    if (afr !== pin.af) problems.push(`${name} AFR is AF${afr}, the datasheet's ${t}_CH1 is AF${pin.af}`);
    if ((r.CCER & 1) === 0) problems.push(`${t}_CCER.CC1E is 0: no output`);
    if ((r.CCER & 2) !== 0) problems.push(`${t}_CCER.CC1P is 1: inverted output`);
    if (oc1m === 6) mode = "pwm";
    else if (oc1m === 3) mode = "toggle";
    else problems.push(`${t}_CCMR1.OC1M is ${oc1m}: neither PWM mode 1 (110) nor toggle (011)`);
  } else if (moder === 1) {
    if ((r.DIER & 1) === 0) problems.push(`${t}_DIER.UIE is 0: no update interrupt drives ${name}`);
    if ((run.nvicIser & (1 << DATASHEET_IRQ[t])) === 0)
      problems.push(`NVIC IRQ ${DATASHEET_IRQ[t]} (${t}) not enabled`);
    mode = "isr";
  } else {
    problems.push(`${name} MODER is ${moder}: neither output (01) nor alternate function (10)`);
  }
  return { problems, stop: false, mode, countS, updateS, sysclkHz: run.sysclkHz };
}

export interface Stm32Output {
  periodS: number;
  highS: number;
  /** Edges counted from the counter start (CEN), level after the edge. */
  edges: { t: number; level: 0 | 1 }[];
  problems: string[];
  /** Time the output covers in the run (interrupt plans: the handler calls made). */
  coveredS: number;
}

/** PWM mode 1 (high while CNT < CCR1) or toggle on match (RM0444 output compare), from the registers. */
export function registerOutput(
  run: Stm32Run,
  t: Stm32Timer,
  mode: "pwm" | "toggle",
  s: Stm32Setup,
): Stm32Output {
  const r = run.timers[t];
  const edges: Stm32Output["edges"] = [];
  if (mode === "pwm") {
    const periodS = s.updateS;
    const highS = Math.min(r.CCR1, r.ARR + 1) * s.countS;
    for (let k = 0; k < 3; k++) {
      if (highS > 0 && highS < periodS)
        edges.push({ t: k * periodS, level: 1 }, { t: k * periodS + highS, level: 0 });
    }
    return { periodS, highS, edges, problems: [], coveredS: 3 * periodS };
  }
  // Toggle: OC1REF changes at every CNT = CCR1 match, once per update period: two update periods per output period.
  const first = Math.min(r.CCR1, r.ARR) * s.countS;
  for (let k = 0; k < 6; k++) edges.push({ t: first + k * s.updateS, level: k % 2 === 0 ? 1 : 0 });
  return { periodS: 2 * s.updateS, highS: s.updateS, edges, problems: [], coveredS: first + 6 * s.updateS };
}

/** Interrupt plans: the pin level after each handler call, one call per update period. */
export function interruptOutput(
  run: Stm32Run,
  t: Stm32Timer,
  initial: 0 | 1,
  s: Stm32Setup,
): Stm32Output | string {
  if (run.error) return run.error;
  const problems: string[] = [];
  if (run.isrCalls.some((c) => !c.uifCleared)) problems.push("the handler left UIF set");
  const levels = run.isrCalls.map((c) => (c.level ? 1 : 0) as 0 | 1);
  const lp = levelPeriod(levels);
  if (!lp || lp.high === 0 || lp.high === lp.period)
    return `${t}'s handler did not make P${DATASHEET_CH1_PIN[t].port}${DATASHEET_CH1_PIN[t].bit} alternate over ${levels.length} interrupts: ${levels.join("")}`;
  const edges: Stm32Output["edges"] = [];
  let prev = initial;
  levels.forEach((l, k) => {
    if (l !== prev && edges.length < 8) edges.push({ t: (k + 1) * s.updateS, level: l });
    prev = l;
  });
  return {
    periodS: lp.period * s.updateS,
    highS: lp.high * s.updateS,
    edges,
    problems,
    coveredS: levels.length * s.updateS,
  };
}
