// Timing over the travel of an adjustable stage value, with the tolerance
// band and the positions where the stage stops running (will-it-oscillate
// limits). Each point runs the stage's own model (analyzeStage), so the law
// over the travel is exactly the old stage's law: for an RC stage the period
// follows R (linear in R for the 555 and Schmitt stages), for a mains-synced
// stage the firing delay follows the synchronised model.
import { EngineError } from "../errors";
import { analyzeStage, STAGE_FIELDS, validateStage } from "../analyze-stage";
import type { Stage, StageAnalysis } from "../stage-types";
import { fmt } from "../stages/model";
import type { EngUnit } from "../units";
import { taperFraction } from "./taper";
import type {
  StageControl,
  TravelAnalysis,
  TravelCheck,
  TravelLimit,
  TravelPoint,
  TravelQuantity,
} from "./types";

export const DEFAULT_TRAVEL_POINTS = 41;
/** Bisection steps to place a limit between two sampled points: 2^-30 of the gap. */
const LIMIT_BISECTION_STEPS = 30;
/** Samples of the Monte Carlo part of analyzeStage; the band uses only the corners. */
const BAND_SAMPLES = 1;

function bad(field: string, message: string): never {
  throw new EngineError("invalid-stage", message, field);
}

/** Checks the control against the stage; bad input names its field and changes nothing. */
export function validateControl(stage: Stage, control: unknown): StageControl {
  if (typeof control !== "object" || control === null)
    bad("control", "The control must be an object with a kind.");
  const c = control as Record<string, unknown>;
  if (c.kind !== "pot" && c.kind !== "trimmer" && c.kind !== "selector")
    bad("control.kind", 'control.kind must be "pot", "trimmer" or "selector".');
  const fields = STAGE_FIELDS[stage.kind] ?? [];
  const f = fields.find((x) => x.name === c.field);
  if (!f || f.unit === "bool")
    bad("control.field", `The ${stage.kind} stage has no numeric field "${String(c.field)}" to adjust.`);
  if (c.kind === "selector") {
    const values = c.values;
    if (!Array.isArray(values) || values.length < 2 || values.length > 16)
      bad("control.values", "A selector needs a list of 2 to 16 values.");
    values.forEach((v, i) => {
      if (typeof v !== "number" || !Number.isFinite(v) || v <= 0)
        bad(`control.values.${i}`, `Selector position ${i + 1} must be a positive number.`);
    });
    return { kind: "selector", field: f.name, values: [...(values as number[])] };
  }
  if (f.unit !== "Ω")
    bad(
      "control.field",
      `A ${c.kind} sets a resistance; "${f.name}" is in ${f.unit || "a ratio"}. Use a selector.`,
    );
  const series = c.seriesR ?? 0;
  if (typeof series !== "number" || !Number.isFinite(series) || series < 0)
    bad("control.seriesR", "The series resistor must be 0 Ω or more.");
  if (typeof c.trackR !== "number" || !Number.isFinite(c.trackR) || c.trackR <= 0)
    bad("control.trackR", "The track resistance must be a positive number of ohms.");
  if (series + c.trackR <= 0) bad("control.trackR", "The control must give a resistance above 0 Ω.");
  if (c.kind === "trimmer") return { kind: "trimmer", field: f.name, seriesR: series, trackR: c.trackR };
  if (c.taper !== "linear" && c.taper !== "log")
    bad("control.taper", 'control.taper must be "linear" or "log".');
  return { kind: "pot", field: f.name, seriesR: series, trackR: c.trackR, taper: c.taper };
}

/** The stage field's value at a rotation (pot, trimmer) or switch position (selector). */
export function controlValue(control: StageControl, position: number): number {
  if (control.kind === "selector") return control.values[position];
  const taper = control.kind === "pot" ? control.taper : "linear";
  return control.seriesR + control.trackR * taperFraction(taper, position);
}

/** The stage with the control at one position (the field replaced, its tolerance kept). */
export function stageAt(stage: Stage, control: StageControl, position: number): Stage {
  return validateStage({ ...stage, [control.field]: controlValue(control, position) });
}

function quantityOf(stage: Stage): TravelQuantity {
  return "sync" in stage && stage.sync ? "firingDelayS" : "periodS";
}

function timingOf(a: StageAnalysis, q: TravelQuantity): number {
  if (!a.oscillates) return NaN;
  return q === "firingDelayS" ? (a.sync?.firingDelayS ?? NaN) : a.periodS;
}

function pointAt(stage: Stage, control: StageControl, position: number, q: TravelQuantity): TravelPoint {
  const s = stageAt(stage, control, position);
  const a = analyzeStage(s, { samples: BAND_SAMPLES });
  const timingS = timingOf(a, q);
  const running = Number.isFinite(timingS);
  const point: TravelPoint = {
    position,
    value: controlValue(control, position),
    timingS,
    highS: running ? a.highS : NaN,
    oscillates: running,
  };
  const corners = q === "firingDelayS" ? a.spread?.firingDelayS?.corners : a.spread?.corners.periodS;
  if (running && corners && Number.isFinite(corners.min)) point.band = { min: corners.min, max: corners.max };
  if (!running)
    point.reason = a.checks.find((c) => c.level === "error")?.message ?? "The stage does not run here.";
  return point;
}

function runs(stage: Stage, control: StageControl, x: number, q: TravelQuantity): boolean {
  return Number.isFinite(timingOf(analyzeStage(stageAt(stage, control, x), { samples: BAND_SAMPLES }), q));
}

/** Bisects between a running and a stopped rotation to the rotation where the stage changes. */
function limitBetween(
  stage: Stage,
  control: StageControl,
  a: TravelPoint,
  b: TravelPoint,
  q: TravelQuantity,
): TravelLimit {
  let run = a.oscillates ? a.position : b.position;
  let stop = a.oscillates ? b.position : a.position;
  for (let i = 0; i < LIMIT_BISECTION_STEPS; i++) {
    const mid = (run + stop) / 2;
    if (runs(stage, control, mid, q)) run = mid;
    else stop = mid;
  }
  return {
    position: run,
    value: controlValue(control, run),
    side: a.oscillates ? "stops-above" : "stops-below",
  };
}

const pct = (x: number) => `${(x * 100).toFixed(1)} %`;

/**
 * Timing over the control's travel. Pot and trimmer: `points` evenly spaced
 * rotations from 0 to 1 (at least 3: minimum, middle and maximum are always
 * among them when the count is odd). Selector: every switch position.
 * Throws EngineError("invalid-stage") naming the field for bad input.
 */
export function analyzeTravel(
  stage: Stage,
  controlInput: unknown,
  points = DEFAULT_TRAVEL_POINTS,
): TravelAnalysis {
  const valid = validateStage(stage);
  const control = validateControl(valid, controlInput);
  if (!Number.isInteger(points) || points < 3 || points > 401)
    bad("points", "The travel needs 3 to 401 points.");
  const q = quantityOf(valid);
  const positions =
    control.kind === "selector"
      ? control.values.map((_, i) => i)
      : Array.from({ length: points }, (_, i) => i / (points - 1));
  const list = positions.map((x) => pointAt(valid, control, x, q));
  const limits: TravelLimit[] = [];
  const checks: TravelCheck[] = [];
  const where = control.kind === "selector" ? "control.values" : "control.trackR";
  const unit = (STAGE_FIELDS[valid.kind].find((f) => f.name === control.field)?.unit ?? "") as EngUnit;
  if (control.kind !== "selector") {
    for (let i = 1; i < list.length; i++) {
      if (list[i].oscillates !== list[i - 1].oscillates)
        limits.push(limitBetween(valid, control, list[i - 1], list[i], q));
    }
  }
  const running = list.filter((p) => p.oscillates);
  const stopped = list.filter((p) => !p.oscillates);
  if (running.length === 0) {
    checks.push({
      level: "error",
      code: "control-never-runs",
      field: where,
      message: `The stage does not run anywhere on the control's travel (${fmt(list[0].value, unit)} to ${fmt(list[list.length - 1].value, unit)}): ${stopped[0].reason}`,
    });
  } else if (stopped.length > 0) {
    const spans =
      control.kind === "selector"
        ? stopped.map((p) => `position ${p.position + 1}`).join(", ")
        : limits
            .map((l) =>
              l.side === "stops-above"
                ? `above ${pct(l.position)} of the travel (${control.field} over ${fmt(l.value, "Ω")})`
                : `below ${pct(l.position)} of the travel (${control.field} under ${fmt(l.value, "Ω")})`,
            )
            .join(" and ");
    checks.push({
      level: "error",
      code: "control-crosses-limit",
      field: where,
      message: `The control's range crosses the stage's limit: ${spans} the stage does not run. ${stopped[0].reason} Change the series resistor or the track so the whole travel stays inside the limit.`,
    });
  }
  const times = running.map((p) => p.timingS);
  return {
    control,
    quantity: q,
    points: list,
    limits,
    runningRange: times.length ? { minS: Math.min(...times), maxS: Math.max(...times) } : null,
    checks,
  };
}
