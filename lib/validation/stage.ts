// One stage schema for every kind: the fields come from the engine's
// STAGE_FIELDS, values may be numbers (SI) or engineering-notation strings, and
// the engine's own validateStage has the last word, so the form and the server
// refuse exactly the same stages, each message on its field. Built with
// "zod/mini": the workspace form validates with this schema in the browser.
import * as z from "zod/mini";
import {
  isEngineError,
  STAGE_FIELDS,
  STAGE_KINDS,
  SYNC_FIELDS,
  SYNC_KINDS,
  validateStage,
  type EngUnit,
  type Stage,
  type StageField,
  type StageKind,
  type Tolerances,
} from "@/lib/engine";
import { readEng } from "./eng";
import { customIssue } from "./issue";
import { formText } from "./form-text";
import { formatTolerance, readTolerance } from "./tolerance";
import { plainMessage } from "./plain-message";
import { measurementProblems } from "./measurement";

export const STAGE_KIND_IDS = STAGE_KINDS.map((k) => k.kind) as [StageKind, ...StageKind[]];

function readField(
  f: StageField,
  raw: unknown,
): { ok: true; value: unknown } | { ok: false; message: string } {
  if (raw === undefined || raw === null || raw === "") {
    return f.optional ? { ok: true, value: undefined } : { ok: false, message: `${f.label} is required.` };
  }
  if (f.unit === "bool") {
    if (typeof raw === "boolean") return { ok: true, value: raw };
    if (raw === "true" || raw === "on") return { ok: true, value: true };
    if (raw === "false" || raw === "off") return { ok: true, value: false };
    return { ok: false, message: `${f.label} must be yes or no.` };
  }
  const r = readEng(raw, f.unit as EngUnit);
  if (!r.ok) return r;
  if (f.range === "positive" && !(r.value > 0))
    return { ok: false, message: `${f.label} must be greater than 0.` };
  if (f.range === "nonNegative" && !(r.value >= 0))
    return { ok: false, message: `${f.label} must not be negative.` };
  if (f.range === "fraction" && !(r.value > 0 && r.value < 1)) {
    return { ok: false, message: `${f.label} must be between 0 and 1.` };
  }
  return r;
}

const stageShape = z.looseObject({
  kind: z.enum(STAGE_KIND_IDS, { error: `Choose a stage kind: ${STAGE_KIND_IDS.join(", ")}.` }),
  tolerances: z.optional(z.record(z.string(), z.unknown())),
});

export const stageSchema = z.pipe(
  stageShape,
  z.transform((input: z.output<typeof stageShape>, ctx): Stage => {
    const fields = STAGE_FIELDS[input.kind];
    const out: Record<string, unknown> = { kind: input.kind };
    let bad = false;
    for (const f of fields) {
      const r = readField(f, (input as Record<string, unknown>)[f.name]);
      if (!r.ok) {
        customIssue(ctx, r.message, [f.name]);
        bad = true;
      } else if (r.value !== undefined) out[f.name] = r.value;
    }
    // Mains synchronisation (engine.md section 6) of a UJT, PUT or threshold
    // stage: both fields blank = free-running; kept so a saved stage never loses it.
    const sync = (input as { sync?: unknown }).sync;
    if (sync && typeof sync === "object" && (SYNC_KINDS as readonly string[]).includes(input.kind)) {
      const raw = sync as Record<string, unknown>;
      const blank = SYNC_FIELDS.every((f) => raw[f.name] === undefined || raw[f.name] === "");
      if (!blank) {
        const got: Record<string, unknown> = {};
        for (const f of SYNC_FIELDS) {
          const r = readField(f, raw[f.name]);
          if (!r.ok) {
            customIssue(ctx, r.message, ["sync", f.name]);
            bad = true;
          } else got[f.name] = r.value;
        }
        out.sync = got;
      }
    }
    const tolerances: Tolerances = {};
    for (const [name, raw] of Object.entries(input.tolerances ?? {})) {
      const r = readTolerance(raw);
      if (!r.ok) {
        customIssue(ctx, r.message, ["tolerances", name]);
        bad = true;
      } else if (
        r.value !== undefined &&
        !(r.value === 0 || (Array.isArray(r.value) && r.value[0] === 0 && r.value[1] === 0))
      ) {
        tolerances[name] = r.value;
      }
    }
    if (Object.keys(tolerances).length > 0) out.tolerances = tolerances;
    if (bad) return z.NEVER;
    // A measured stage is only as plausible as the devices that must make it.
    if (input.kind === "measured") {
      const problems = measurementProblems(out as { periodS?: number; highS?: number });
      for (const [field, message] of Object.entries(problems)) customIssue(ctx, message, [field]);
      if (Object.keys(problems).length > 0) return z.NEVER;
    }
    try {
      return validateStage(out);
    } catch (e) {
      if (!isEngineError(e)) throw e;
      customIssue(ctx, plainMessage(e.message, input.kind), (e.field ?? "kind").split("."));
      return z.NEVER;
    }
  }),
);

export type StageInput = z.input<typeof stageSchema>;

/** Form values of a stage: every field as text in engineering notation. */
export type StageFormValues = { kind: StageKind; tolerances: Record<string, string> } & Record<
  string,
  unknown
>;

const FORM_UNIT: Record<string, EngUnit> = { Ω: "Ω", F: "F", V: "V", A: "A", s: "s", "": "" };

/** A stored stage as form text (4.7 kΩ -> "4.7k"), so a round trip reads the same. */
export function stageToForm(stage: Stage | null, kind?: StageKind): StageFormValues {
  const k = kind ?? stage?.kind ?? "ujt";
  const values: StageFormValues = { kind: k, tolerances: {} };
  const same = stage && stage.kind === k ? (stage as unknown as Record<string, unknown>) : {};
  for (const f of STAGE_FIELDS[k]) {
    const v = same[f.name];
    if (f.unit === "bool") values[f.name] = v === true;
    else values[f.name] = typeof v === "number" ? engText(v, FORM_UNIT[f.unit]) : "";
    values.tolerances[f.name] = formatTolerance(stage?.kind === k ? stage.tolerances?.[f.name] : undefined);
  }
  if ((SYNC_KINDS as readonly string[]).includes(k)) {
    const sync = (same as { sync?: Record<string, unknown> }).sync;
    values.sync = Object.fromEntries(
      SYNC_FIELDS.map((f) => [
        f.name,
        typeof sync?.[f.name] === "number" ? formText(sync[f.name] as number) : "",
      ]),
    );
  }
  return values;
}

function engText(v: number, unit: EngUnit): string {
  // Plain fractions (eta) stay plain; others get a prefix without the unit.
  if (unit === "") return String(v);
  return formText(v);
}
