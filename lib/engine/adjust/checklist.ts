// What the technician checks on site for a kept control: the period at
// minimum, middle and maximum of its travel, each with pass limits by the
// checklist's own rule (achieved ± (clock accuracy × value + jitter + one
// timer count), lib/bundle/limits.ts), and for a trimmer the calibration step.
import { analyzeStage } from "../analyze-stage";
import type { Stage } from "../stage-types";
import type { AdcTable } from "./adc-table";
import { stageAt, validateControl } from "./travel";
import { taperFraction } from "./taper";

/**
 * A knob set by eye to the middle of its travel lands within ±5 % of the
 * travel (common practice, no source); the ends are set against the stops.
 */
export const MIDDLE_BY_EYE = 0.05;

export interface TravelCheckLine {
  where: "minimum" | "middle" | "maximum";
  instruction: string;
  expectedS: number;
  minS: number;
  maxS: number;
}

export function travelChecklist(
  table: AdcTable,
  clockAccuracyPpm = table.plan.clockAccuracyPpm,
): TravelCheckLine[] {
  const plan = table.plan;
  const countS = (plan.divider * plan.modeFactor) / plan.clockHz;
  const widen = (v: number) => v * clockAccuracyPpm * 1e-6 + (plan.jitterS ?? 0) + countS;
  const steps = table.steps;
  const last = steps.length - 1;
  const line = (
    where: TravelCheckLine["where"],
    instruction: string,
    lo: number,
    hi: number,
    expectedS: number,
  ) => ({
    where,
    instruction,
    expectedS,
    minS: lo - widen(lo),
    maxS: hi + widen(hi),
  });
  // the steps the wiper's counts fall in anywhere within the middle ± MIDDLE_BY_EYE
  const top = (1 << table.adcBits) - 1;
  const taper = table.taper;
  const lo = taperFraction(taper, 0.5 - MIDDLE_BY_EYE) * top;
  const hi = taperFraction(taper, 0.5 + MIDDLE_BY_EYE) * top;
  const middle = steps.filter((s) => s.toCount >= lo && s.fromCount <= hi);
  const mids = middle.map((s) => s.periodS);
  const centre = steps.reduce(
    (b, s) => (Math.abs(s.rotation - 0.5) < Math.abs(b.rotation - 0.5) ? s : b),
    steps[0],
  );
  return [
    line(
      "minimum",
      "Turn the control fully anticlockwise to its stop and measure the period.",
      steps[0].periodS,
      steps[0].periodS,
      steps[0].periodS,
    ),
    line(
      "middle",
      "Set the control by eye to the middle of its travel and measure the period.",
      Math.min(...mids),
      Math.max(...mids),
      centre.periodS,
    ),
    line(
      "maximum",
      "Turn the control fully clockwise to its stop and measure the period.",
      steps[last].periodS,
      steps[last].periodS,
      steps[last].periodS,
    ),
  ];
}

export interface TrimmerCalibration {
  /** period of the old stage with the trimmer at either end: the range the constant may take */
  periodAtStartS: number;
  periodAtEndS: number;
  instruction: string;
}

/**
 * A trimmer is set once, so the new board holds its effect as a calibration
 * constant: the period the old board was trimmed to, measured on site before
 * the old board comes out and entered into the firmware's constant.
 */
export function trimmerCalibration(stage: Stage, controlInput: unknown): TrimmerCalibration {
  const control = validateControl(stage, controlInput);
  if (control.kind !== "trimmer") throw new TypeError("trimmerCalibration takes a trimmer control");
  const a = analyzeStage(stageAt(stage, control, 0), { samples: 1 }).periodS;
  const b = analyzeStage(stageAt(stage, control, 1), { samples: 1 }).periodS;
  return {
    periodAtStartS: a,
    periodAtEndS: b,
    instruction: `Before removing the old board, measure its period as trimmed (it must lie between the trimmer's ends, ${Math.min(a, b)} s and ${Math.max(a, b)} s), write it into the calibration constant of the firmware, rebuild, flash, and measure again.`,
  };
}
