// The numbers that changed between two revisions: stage values and
// tolerances, the old stage's period and high time, and per target the clock,
// timer, divider, counts, achieved timing, errors, registers and pin. Each side
// is flattened to key -> value first, so the comparison itself is one loop.
import { formatEng, formatPpm, formatRatio, STAGE_FIELDS, type EngUnit } from "@/lib/engine";
import type { NumberChange, RevisionSnapshot } from "./types";

type Value = number | string | boolean;
type Fmt = "eng" | "ppm" | "percent" | "hex" | "plain";
type Entry = { what: string; value: Value; unit: EngUnit; fmt: Fmt };
type Flat = Map<string, Entry>;

const obj = (v: unknown): Record<string, unknown> =>
  v !== null && typeof v === "object" && !Array.isArray(v) ? (v as Record<string, unknown>) : {};
const isValue = (v: unknown): v is Value =>
  (typeof v === "number" && !Number.isNaN(v)) || typeof v === "string" || typeof v === "boolean";

function put(flat: Flat, key: string, what: string, value: unknown, unit: EngUnit = "", fmt: Fmt = "eng") {
  if (isValue(value)) flat.set(key, { what, value, unit, fmt });
}

function stageUnit(kind: string, field: string): EngUnit {
  const fields = (STAGE_FIELDS as Record<string, readonly { name: string; unit: string }[]>)[kind] ?? [];
  const unit = fields.find((f) => f.name === field)?.unit;
  return unit && unit !== "bool" ? (unit as EngUnit) : "";
}

/** The label the form shows for a stage field ("Timing resistor"), not its key. */
function stageLabel(kind: string, field: string): string {
  const fields = (STAGE_FIELDS as Record<string, readonly { name: string; label: string }[]>)[kind] ?? [];
  return fields.find((f) => f.name === field)?.label ?? field;
}

function flattenStage(flat: Flat, stage: Record<string, unknown>) {
  const kind = typeof stage.kind === "string" ? stage.kind : "";
  put(flat, "stage.kind", "Stage kind", kind, "", "plain");
  for (const [name, value] of Object.entries(stage)) {
    if (name === "kind" || name === "tolerances") continue;
    put(flat, `stage.${name}`, `Old stage: ${stageLabel(kind, name)}`, value, stageUnit(kind, name));
  }
  for (const [name, tol] of Object.entries(obj(stage.tolerances))) {
    const text = Array.isArray(tol)
      ? tol.map((t) => `${Number((Number(t) * 100).toPrecision(4))}`).join(" / ")
      : tol;
    if (Array.isArray(tol))
      put(
        flat,
        `stage.tolerance.${name}`,
        `Tolerance of ${stageLabel(kind, name)} (−/+ %)`,
        text,
        "",
        "plain",
      );
    else put(flat, `stage.tolerance.${name}`, `Tolerance of ${stageLabel(kind, name)}`, text, "%", "percent");
  }
}

function flattenAnalysis(flat: Flat, a: Record<string, unknown>) {
  put(flat, "analysis.periodS", "Old stage period", a.periodS, "s");
  put(flat, "analysis.highS", "Old stage high time", a.highS, "s");
  put(flat, "analysis.duty", "Old stage duty cycle", a.duty, "%", "percent");
  put(flat, "analysis.frequencyHz", "Old stage frequency", a.frequencyHz, "Hz");
}

const PLAN_FIELDS: [string, string, EngUnit, Fmt][] = [
  ["device", "device", "", "plain"],
  ["clockHz", "clock", "Hz", "eng"],
  ["clockSource", "clock source", "", "plain"],
  ["timer", "timer", "", "plain"],
  ["mode", "mode", "", "plain"],
  ["divider", "divider", "", "plain"],
  ["periodCounts", "period counts", "", "plain"],
  ["highCounts", "high counts", "", "plain"],
  ["softwareDivider", "software divider", "", "plain"],
  ["periodS", "period", "s", "eng"],
  ["highS", "high time", "s", "eng"],
  ["periodErrorPpm", "period error", "ppm", "ppm"],
  ["highErrorPpm", "high-time error", "ppm", "ppm"],
  ["clockAccuracyPpm", "clock accuracy", "ppm", "ppm"],
];

function flattenPlan(flat: Flat, plan: Record<string, unknown>, n: number) {
  const p = `target${n}`;
  for (const [field, label, unit, fmt] of PLAN_FIELDS)
    put(flat, `${p}.${field}`, `Target ${n} ${label}`, plan[field], unit, fmt);
  for (const [reg, value] of Object.entries(obj(plan.registers))) {
    put(flat, `${p}.registers.${reg}`, `Target ${n} ${reg}`, value, "", "hex");
  }
  const pin = obj(plan.pin);
  put(flat, `${p}.pin.port`, `Target ${n} pin port`, pin.port, "", "plain");
  put(flat, `${p}.pin.function`, `Target ${n} pin function`, pin.function, "", "plain");
  put(flat, `${p}.pin.packagePin`, `Target ${n} package pin`, pin.packagePin, "", "plain");
}

export function flattenRevision(rev: Pick<RevisionSnapshot, "spec" | "analysis" | "plans">): Flat {
  const flat: Flat = new Map();
  flattenStage(flat, obj(obj(rev.spec).stage));
  flattenAnalysis(flat, obj(rev.analysis));
  const plans = Array.isArray(rev.plans) ? rev.plans : [];
  plans.forEach((entry, i) => {
    // Stored revisions keep { target, plan, budget } per target; a bare plan is accepted too.
    const e = obj(entry);
    const plan = "plan" in e ? obj(e.plan) : e;
    flattenPlan(flat, plan, i + 1);
    const target = obj(e.target);
    put(
      flat,
      `target${i + 1}.requiredTolerancePct`,
      `Target ${i + 1} required tolerance (%)`,
      target.requiredTolerancePct,
      "",
      "plain",
    );
  });
  return flat;
}

/** Text for one value: engineering notation with units, ppm and % for errors, hex for registers. */
export function formatValue(e: Pick<Entry, "value" | "unit" | "fmt"> | undefined): string {
  if (!e) return "—";
  const v = e.value;
  if (typeof v !== "number") return String(v);
  switch (e.fmt) {
    case "ppm":
      return formatPpm(v, 4);
    case "percent":
      return `${Number((v * 100).toPrecision(4))} %`;
    case "hex":
      return Number.isInteger(v) && v >= 0 ? `0x${v.toString(16).toUpperCase()} (${v})` : String(v);
    case "plain":
      return String(v);
    default:
      // A dimensionless ratio (standoff ratio) reads 0.65, never "650m".
      return e.unit === "" ? formatRatio(v, 4) : formatEng(v, e.unit, 4);
  }
}

/** Every key whose value differs (or exists on one side only), in the order of `a` then the new keys of `b`. */
export function changedNumbers(
  a: Pick<RevisionSnapshot, "spec" | "analysis" | "plans">,
  b: Pick<RevisionSnapshot, "spec" | "analysis" | "plans">,
): NumberChange[] {
  const fa = flattenRevision(a);
  const fb = flattenRevision(b);
  const keys = [...fa.keys(), ...[...fb.keys()].filter((k) => !fa.has(k))];
  const out: NumberChange[] = [];
  for (const key of keys) {
    const ea = fa.get(key);
    const eb = fb.get(key);
    if (ea && eb && Object.is(ea.value, eb.value)) continue;
    out.push({
      key,
      what: (eb ?? ea)!.what,
      before: formatValue(ea),
      after: formatValue(eb),
      beforeValue: ea?.value ?? null,
      afterValue: eb?.value ?? null,
    });
  }
  return out;
}
