// The target side of a potentiometer: the MCU reads the wiper on an ADC pin
// and looks the timer setting up in a table computed here with the old
// stage's own law (analyzeTravel's model per step), so a step of the knob
// gives the same period on the new board as on the old one. One timer
// divider for the whole table (the one the solver picks for the longest
// period), so only the compare registers change while running.
import { EngineError } from "../errors";
import { planTarget } from "../solver/plan";
import type { Stage } from "../stage-types";
import type { TimerPlan } from "../plan-types";
import { analyzeStage, validateStage } from "../analyze-stage";
import { stageAt, validateControl } from "./travel";
import { controlValue } from "./travel";
import { taperRotation } from "./taper";
import type { Taper } from "./types";

export interface AdcTableRequest {
  stage: Stage;
  control: unknown;
  device: string;
  clockHz: number;
  clockSource?: string;
  timer?: string;
  /** ADC resolution of the device (10 for the AVRs, PIC and MSP430; 12 for STM32G031 and RP2040) */
  adcBits: number;
  /** table entries over the travel, a power of two from 8 to 256 */
  steps: number;
  /** ADC counts the wiper must move past a step edge before the output changes */
  hysteresisCounts?: number;
}

export interface AdcStep {
  index: number;
  /** first and last ADC count of the step (without hysteresis) */
  fromCount: number;
  toCount: number;
  /**
   * Track fraction 0..1 the step stands for (step 0 = the grounded end, the
   * last = the supply end). The pot is read as a divider, so the wiper
   * voltage is this fraction of the reference whatever the taper.
   */
  fraction: number;
  /** the knob rotation giving that fraction with the pot's taper */
  rotation: number;
  /** the stage's own period and high time there */
  wantS: number;
  wantHighS: number;
  periodCounts: number;
  highCounts: number;
  /** achieved with the table's divider */
  periodS: number;
  highS: number;
  errorPpm: number;
}

export interface AdcTable {
  /** the plan of the longest-period step; its divider, timer and mode hold for every step */
  plan: TimerPlan;
  adcBits: number;
  /** the pot's taper (the middle-by-eye check converts rotation to track fraction with it) */
  taper: Taper;
  countsPerStep: number;
  hysteresisCounts: number;
  steps: AdcStep[];
  /** largest change of period between adjacent steps, relative to the smaller, in ppm */
  worstStepPpm: number;
  /** largest |achieved - stage| over the table, in ppm */
  worstErrorPpm: number;
}

/** Default hysteresis: 2 ADC counts, above the usual ±1 LSB of noise plus quantisation (common practice, no source). */
export const DEFAULT_HYSTERESIS_COUNTS = 2;

function bad(field: string, message: string): never {
  throw new EngineError("invalid-request", message, field);
}

/** The step an ADC count selects, keeping `current` while the count stays within the hysteresis of its edges. */
export function stepForCount(
  count: number,
  current: number,
  countsPerStep: number,
  hysteresis: number,
  steps: number,
): number {
  const lo = current * countsPerStep - hysteresis;
  const hi = (current + 1) * countsPerStep - 1 + hysteresis;
  if (current >= 0 && current < steps && count >= lo && count <= hi) return current;
  return Math.min(steps - 1, Math.max(0, Math.floor(count / countsPerStep)));
}

export function buildAdcTable(req: AdcTableRequest): AdcTable {
  const stage = validateStage(req.stage);
  const control = validateControl(stage, req.control);
  if (control.kind !== "pot")
    bad(
      "control.kind",
      "Only a potentiometer is read on an ADC pin; a trimmer becomes a calibration constant and a selector input pins.",
    );
  if ("sync" in stage && stage.sync)
    bad(
      "stage.sync",
      "A mains-synchronised stage's control sets the firing delay: its ADC table comes with the zero-cross firmware, not this free-running table.",
    );
  if (req.adcBits !== 10 && req.adcBits !== 12) bad("adcBits", "adcBits must be 10 or 12.");
  const full = 1 << req.adcBits;
  if (!Number.isInteger(req.steps) || req.steps < 8 || req.steps > 256 || (req.steps & (req.steps - 1)) !== 0)
    bad("steps", "steps must be a power of two from 8 to 256.");
  const countsPerStep = full / req.steps;
  const hysteresis = req.hysteresisCounts ?? DEFAULT_HYSTERESIS_COUNTS;
  if (!Number.isInteger(hysteresis) || hysteresis < 0 || hysteresis * 2 >= countsPerStep)
    bad(
      "hysteresisCounts",
      `hysteresisCounts must be a whole number from 0 to below half a step (${countsPerStep / 2} counts).`,
    );
  const want = Array.from({ length: req.steps }, (_, k) => {
    // The same pot, wired as a divider, puts its track fraction on the ADC:
    // the step's stage value is seriesR + trackR * fraction for any taper.
    const fraction = k / (req.steps - 1);
    const rotation = taperRotation(control.taper, fraction);
    const a = analyzeStage(stageAt(stage, control, rotation), { samples: 1 });
    if (!a.oscillates)
      bad(
        "control",
        `At ${(rotation * 100).toFixed(1)} % of the travel (${control.field} = ${controlValue(control, rotation)} Ω) the stage does not run; keep the whole travel inside its limits.`,
      );
    return { fraction, rotation, periodS: a.periodS, highS: a.highS };
  });
  const longest = want.reduce((m, w) => (w.periodS > m.periodS ? w : m), want[0]);
  const { plan, tick } = commonDividerPlan(req, longest);
  const highTick = tick;
  const steps: AdcStep[] = want.map((w, k) => {
    const periodCounts = Math.max(2, Math.round(w.periodS / tick));
    const highCounts = Math.min(periodCounts - 1, Math.max(1, Math.round(w.highS / highTick)));
    const periodS = periodCounts * tick;
    return {
      index: k,
      fromCount: k * countsPerStep,
      toCount: (k + 1) * countsPerStep - 1,
      fraction: w.fraction,
      rotation: w.rotation,
      wantS: w.periodS,
      wantHighS: w.highS,
      periodCounts,
      highCounts,
      periodS,
      highS: highCounts * highTick,
      errorPpm: ((periodS - w.periodS) / w.periodS) * 1e6,
    };
  });
  let worstStepPpm = 0;
  for (let k = 1; k < steps.length; k++) {
    const a = steps[k - 1].periodS;
    const b = steps[k].periodS;
    worstStepPpm = Math.max(worstStepPpm, (Math.abs(b - a) / Math.min(a, b)) * 1e6);
  }
  return {
    plan,
    adcBits: req.adcBits,
    taper: control.taper,
    countsPerStep,
    hysteresisCounts: hysteresis,
    steps,
    worstStepPpm,
    worstErrorPpm: Math.max(...steps.map((s) => Math.abs(s.errorPpm))),
  };
}

/** Where the timer settings of a table come from: the target and its clock. */
export interface TablePlanRequest {
  device: string;
  clockHz: number;
  clockSource?: string;
  timer?: string;
}

/**
 * Plans the longest timing of a table in hardware PWM and returns that plan
 * with its count length: every entry then uses the same divider, so switching
 * entries changes only TOP and compare.
 */
export function commonDividerPlan(
  req: TablePlanRequest,
  longest: { periodS: number; highS: number },
): { plan: TimerPlan; tick: number } {
  const plan = planTarget({
    device: req.device,
    clockHz: req.clockHz,
    periodS: longest.periodS,
    highS: longest.highS,
    mode: "pwm",
    ...(req.clockSource ? { clockSource: req.clockSource } : {}),
    ...(req.timer ? { timer: req.timer } : {}),
  });
  if (plan.mode !== "pwm" || plan.softwareDivider !== 1)
    bad(
      "control",
      "The longest period of the control's travel needs a software divider on this clock; the kept control needs it in hardware PWM, one divider for every setting: choose a lower clock.",
    );
  const tick = (plan.divider * plan.modeFactor) / plan.clockHz;
  return { plan, tick };
}
