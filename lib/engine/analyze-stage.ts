// analyzeStage: validate a stage, run its model, add warnings and, when the
// stage carries tolerances, the corner and Monte Carlo spread.
import { EngineError } from "./errors";
import type {
  OutputSignal,
  Stage,
  StageAnalysis,
  StageCheck,
  StageField,
  StageKind,
  StageSpread,
  Tolerances,
} from "./stage-types";
import { STAGE_MODELS, modelOf } from "./stages";
import type { ModelResult } from "./stages/model";
import { cornerSpread, monteCarloSpread, type MonteCarloOptions } from "./tolerance";
import { fmt } from "./stages/model";
import { LONGEST_PERIOD_S } from "./solver/validate";
import { checkSync, evaluateSynced, syncOf, syncWarnings, type SyncableStage } from "./stages/synced";
import type { MainsSync } from "./stage-types";

type SyncedStage = SyncableStage & { sync: MainsSync };

/** The stage's timing per parameter set: synchronised stages fire once per half cycle. */
function evaluateAny(stage: Stage): ModelResult {
  return syncOf(stage) ? evaluateSynced(stage as SyncedStage).result : modelOf(stage).evaluate(stage);
}

/** Firing delay as the "period" of a timing function, so the spread helpers can sweep it. */
function delayTiming(stage: Stage) {
  const r = evaluateSynced(stage as SyncedStage);
  return { periodS: r.sync ? r.sync.firingDelayS : NaN, highS: r.result.highS };
}

/** The stage kinds for pickers and forms: label, output, and the input fields. */
export const STAGE_KINDS: readonly {
  kind: StageKind;
  label: string;
  outputSignal: OutputSignal;
  outputLabel: string;
  fields: readonly StageField[];
}[] = Object.values(STAGE_MODELS).map((m) => ({
  kind: m.kind,
  label: m.label,
  outputSignal: m.outputSignal,
  outputLabel: m.outputLabel,
  fields: m.fields,
}));

export const STAGE_FIELDS = Object.fromEntries(
  Object.values(STAGE_MODELS).map((m) => [m.kind, m.fields]),
) as unknown as Readonly<Record<StageKind, readonly StageField[]>>;

// Beyond these a value is a typing slip, not a part (1 TΩ, 100 F, 100 kV, 1 h).
const ABSOLUTE_MAX: Record<string, number> = { Ω: 1e12, F: 100, V: 1e5, A: 1e3, s: 3600 };

// Beyond these a part is unusual enough to say so: board leakage and
// capacitor leakage current start to set the timing (common practice, no source).
const UNUSUAL_ABOVE: Partial<Record<StageField["unit"], number>> = { Ω: 22e6, F: 10e-3 };

function rangeWarnings(stage: Stage): StageCheck[] {
  const out: StageCheck[] = [];
  for (const f of modelOf(stage).fields) {
    const v = (stage as unknown as Record<string, unknown>)[f.name];
    const limit = UNUSUAL_ABOVE[f.unit];
    if (typeof v === "number" && limit !== undefined && v > limit) {
      out.push({
        level: "warning",
        code: "value-range",
        field: f.name,
        message: `${f.label} ${fmt(v, f.unit as "Ω")} is above ${fmt(limit, f.unit as "Ω")}: leakage currents may set the timing more than the formula does. Measure the old stage.`,
      });
    }
  }
  return out;
}

function invalid(field: string, message: string): never {
  throw new EngineError("invalid-stage", message, field);
}

function checkValue(f: StageField, value: unknown): void {
  if (f.range === "bool") {
    if (typeof value !== "boolean") invalid(f.name, `${f.name} must be true or false.`);
    return;
  }
  if (typeof value !== "number") invalid(f.name, `${f.name} must be a number (${f.label}).`);
  if (!Number.isFinite(value)) invalid(f.name, `${f.name} must be a finite number, not ${value}.`);
  if (f.range === "positive" && !(value > 0))
    invalid(f.name, `${f.name} must be greater than 0 (${f.label}).`);
  if (f.range === "nonNegative" && !(value >= 0))
    invalid(f.name, `${f.name} must not be negative (${f.label}).`);
  if (f.range === "fraction" && !(value > 0 && value < 1)) {
    invalid(f.name, `${f.name} must be between 0 and 1 (${f.label}).`);
  }
  const max = ABSOLUTE_MAX[f.unit];
  if (max !== undefined && value > max)
    invalid(f.name, `${f.name} = ${fmt(value, f.unit as "V")} is out of physical range.`);
}

function checkTolerances(
  fields: readonly StageField[],
  tolerances: unknown,
  stage: Record<string, unknown>,
): void {
  if (tolerances === undefined) return;
  if (typeof tolerances !== "object" || tolerances === null || Array.isArray(tolerances)) {
    invalid("tolerances", "tolerances must be an object of field: relative tolerance.");
  }
  for (const [key, t] of Object.entries(tolerances)) {
    const field = `tolerances.${key}`;
    const f = fields.find((x) => x.name === key);
    if (!f || f.range === "bool") invalid(field, `No numeric field "${key}" to put a tolerance on.`);
    if (stage[key] === undefined && f.default === undefined) {
      invalid(field, `A tolerance on ${key} needs a value for ${key}.`);
    }
    const pair = typeof t === "number" ? [t, t] : Array.isArray(t) && t.length === 2 ? t : null;
    if (!pair || !pair.every((x) => typeof x === "number" && Number.isFinite(x))) {
      invalid(field, `${field} must be a number or [minus, plus] (relative, 0.05 = 5 %).`);
    }
    if (!(pair[0] >= 0 && pair[0] < 1))
      invalid(field, `${field}: the minus tolerance must be from 0 to below 1.`);
    if (!(pair[1] >= 0 && pair[1] <= 10))
      invalid(field, `${field}: the plus tolerance must be from 0 to 10.`);
  }
}

/**
 * Throws EngineError("invalid-stage", message, field) for a missing, non-finite
 * or out-of-range field, contradicting inputs (e.g. thresholds reversed) or
 * malformed tolerances. Returns the stage typed.
 */
export function validateStage(input: unknown): Stage {
  if (typeof input !== "object" || input === null) invalid("kind", "A stage must be an object with a kind.");
  const stage = input as Record<string, unknown>;
  const kind = stage.kind;
  if (typeof kind !== "string" || !(kind in STAGE_MODELS)) {
    invalid(
      "kind",
      `Unknown stage kind ${JSON.stringify(kind)}; one of ${Object.keys(STAGE_MODELS).join(", ")}.`,
    );
  }
  const model = STAGE_MODELS[kind as StageKind];
  for (const f of model.fields) {
    const value = stage[f.name];
    if (value === undefined || value === null) {
      if (!f.optional) invalid(f.name, `${f.name} is missing (${f.label}).`);
      continue;
    }
    checkValue(f, value);
  }
  checkTolerances(model.fields, stage.tolerances, stage);
  checkSync(stage);
  const typed = input as Stage;
  modelOf(typed).crossCheck?.(typed);
  return typed;
}

/** The stage with every optional field that has a fixed default filled in. */
export function withDefaults<S extends Stage>(stage: S): S {
  const out: Record<string, unknown> = { ...stage };
  for (const f of modelOf(stage).fields) {
    if (out[f.name] === undefined && f.default !== undefined) out[f.name] = f.default;
  }
  return out as S;
}

export interface SpreadOptions extends MonteCarloOptions {
  tolerances?: Tolerances;
}

/** Corner and Monte Carlo spread of period and high time. */
export function spreadOf(stage: Stage, options: SpreadOptions = {}): StageSpread & { checks: StageCheck[] } {
  const tolerances = options.tolerances ?? stage.tolerances ?? {};
  const full = withDefaults(validateStage({ ...stage, tolerances }));
  const fn = (p: Stage) => evaluateAny(p);
  const corners = cornerSpread(full, tolerances, fn);
  const mc = monteCarloSpread(full, tolerances, fn, options);
  let firingDelayS: StageSpread["firingDelayS"];
  if (syncOf(full)) {
    const dc = cornerSpread(full, tolerances, delayTiming);
    const dm = monteCarloSpread(full, tolerances, delayTiming, options);
    firingDelayS = { corners: dc.periodS, monteCarlo: dm.periodS, failed: dc.failed + dm.failed };
  }
  const checks: StageCheck[] = [];
  if (corners.failed > 0) {
    checks.push({
      level: "warning",
      code: "stops-within-tolerance",
      message: syncOf(full)
        ? `${corners.failed} of ${corners.count} tolerance corners and ${mc.failed} of ${mc.samples} random samples do not fire within the half cycle: a stage built at the edges of these tolerances may leave the load off. The spread shown covers only the firing cases.`
        : `${corners.failed} of ${corners.count} tolerance corners and ${mc.failed} of ${mc.samples} random samples do not oscillate: a stage built at the edges of these tolerances may not run. The spread shown covers only the running cases.`,
    });
  }
  return {
    corners,
    monteCarlo: {
      samples: mc.samples,
      seed: mc.seed,
      failed: mc.failed,
      periodS: mc.periodS,
      highS: mc.highS,
      histogram: mc.histogram,
    },
    ...(firingDelayS ? { firingDelayS } : {}),
    checks,
  };
}

function timingOf(kind: StageKind, r: ModelResult) {
  return {
    periodS: r.periodS,
    highS: r.highS,
    lowS: r.lowS,
    frequencyHz: r.oscillates ? 1 / r.periodS : NaN,
    duty: r.oscillates ? r.highS / r.periodS : NaN,
    kind,
  };
}

/**
 * Models a stage of the old board. Bad input throws EngineError("invalid-stage");
 * a valid stage that cannot oscillate returns oscillates = false, NaN timing
 * and an error-level check saying what to change.
 */
export function analyzeStage(stage: Stage, options: MonteCarloOptions = {}): StageAnalysis {
  const valid = validateStage(stage);
  const model = modelOf(valid);
  const synced = syncOf(valid) ? evaluateSynced(valid as SyncedStage) : null;
  const result = synced ? synced.result : model.evaluate(valid);
  const checks = [...result.checks, ...(model.warnings?.(valid, result) ?? []), ...rangeWarnings(valid)];
  if (result.oscillates && result.periodS > LONGEST_PERIOD_S)
    checks.push({
      level: "error",
      code: "period-beyond-targets",
      message: `The period ${fmt(result.periodS, "s")} is longer than any target can make (${fmt(LONGEST_PERIOD_S, "s")} at the slowest clock of any device). Check the part values.`,
    });
  if (synced?.sync) checks.push(...syncWarnings(valid as SyncedStage, synced.sync));
  const analysis: StageAnalysis = {
    ...timingOf(valid.kind, result),
    outputSignal: model.outputSignal,
    outputLabel: model.outputLabel,
    oscillates: result.oscillates,
    checks,
    ...(synced?.sync ? { sync: synced.sync } : {}),
  };
  const tolerances = valid.tolerances;
  if (result.oscillates && tolerances && Object.keys(tolerances).length > 0) {
    const { checks: spreadChecks, ...spread } = spreadOf(valid, options);
    analysis.spread = spread;
    checks.push(...spreadChecks);
  }
  return analysis;
}
