// The adjustable value of a stage (pot, trimmer, selector) as the API and the
// workspace form send it: numbers in SI or engineering-notation text. The
// engine's validateControl has the last word, so the form, the API and the
// bundle refuse the same controls, each message on its field.
import { isEngineError, parseEng, validateControl, type Stage, type StageControl } from "@/lib/engine";
import { formText } from "./form-text";

/** Form text of a control; kind "none" means a fixed value. */
export interface ControlFormValues {
  kind: "none" | StageControl["kind"];
  field: string;
  seriesR: string;
  trackR: string;
  taper: "linear" | "log";
  values: string;
}

export const NO_CONTROL: ControlFormValues = {
  kind: "none",
  field: "",
  seriesR: "",
  trackR: "",
  taper: "linear",
  values: "",
};

export type ControlRead =
  { ok: true; control: StageControl | null } | { ok: false; field: string; message: string };

class FieldError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
  }
}

function ohms(raw: unknown, field: string, label: string, optional: boolean): number {
  if (raw === undefined || raw === null || (typeof raw === "string" && raw.trim() === "")) {
    if (optional) return 0;
    throw new FieldError(field, `${label} is required.`);
  }
  if (typeof raw === "number") return raw;
  if (typeof raw !== "string") throw new FieldError(field, `${label} must be a resistance (e.g. 47k, 2k2).`);
  try {
    return parseEng(raw, "Ω");
  } catch {
    throw new FieldError(field, `${label}: "${raw}" is not a resistance (e.g. 47k, 2k2).`);
  }
}

function selectorValues(raw: unknown): number[] {
  const list = typeof raw === "string" ? raw.split(/[,;\s]+/).filter(Boolean) : raw;
  if (!Array.isArray(list))
    throw new FieldError("control.values", "List the selector values, e.g. 1u, 2u2, 4u7.");
  return list.map((t: unknown, i) => {
    if (typeof t === "number") return t;
    try {
      return parseEng(String(t));
    } catch {
      throw new FieldError(
        `control.values.${i}`,
        `Selector values, entry ${i + 1} ("${String(t)}") is not a number.`,
      );
    }
  });
}

/**
 * Reads a control against its stage. null, undefined and kind "none" mean a
 * fixed value (no control). Bad input names the field (control.<name>).
 */
export function readControl(stage: Stage, raw: unknown): ControlRead {
  if (raw === undefined || raw === null) return { ok: true, control: null };
  if (typeof raw !== "object")
    return { ok: false, field: "control", message: "The control must be an object with a kind." };
  const c = raw as Record<string, unknown>;
  if (c.kind === "none") return { ok: true, control: null };
  // The kind decides which fields exist, so it is checked before any value is read.
  if (c.kind !== "pot" && c.kind !== "trimmer" && c.kind !== "selector")
    return {
      ok: false,
      field: "control.kind",
      message: 'control.kind must be "none", "pot", "trimmer" or "selector".',
    };
  try {
    const shaped =
      c.kind === "selector"
        ? { kind: c.kind, field: c.field, values: selectorValues(c.values) }
        : {
            kind: c.kind,
            field: c.field,
            seriesR: ohms(c.seriesR, "control.seriesR", "Series resistor", true),
            trackR: ohms(c.trackR, "control.trackR", "Track resistance", false),
            taper: c.taper,
          };
    return { ok: true, control: validateControl(stage, shaped) };
  } catch (e) {
    if (e instanceof FieldError) return { ok: false, field: e.field, message: e.message };
    if (isEngineError(e)) return { ok: false, field: e.field ?? "control", message: e.message };
    throw e;
  }
}

/** A stored control as form text (47 kΩ -> "47k"), so a round trip reads the same. */
export function controlToForm(control: StageControl | null): ControlFormValues {
  if (!control) return { ...NO_CONTROL };
  if (control.kind === "selector")
    return {
      ...NO_CONTROL,
      kind: "selector",
      field: control.field,
      values: control.values.map((v) => formText(v)).join(", "),
    };
  return {
    ...NO_CONTROL,
    kind: control.kind,
    field: control.field,
    seriesR: control.seriesR ? formText(control.seriesR) : "",
    trackR: formText(control.trackR),
    taper: control.kind === "pot" ? control.taper : "linear",
  };
}

/** A stored control as the stage reads it now: null when there is none or it no longer fits the stage. */
export function storedControl(stage: Stage, raw: unknown): StageControl | null {
  if (raw === null || raw === undefined) return null;
  try {
    return validateControl(stage, raw);
  } catch {
    return null;
  }
}

/** Zod refinement step: reads `control` against `stage`, issues on the control's field. */
export function refineControl<T extends { stage?: Stage; control?: unknown }>(
  input: T,
  ctx: { addIssue(issue: { code: "custom"; message: string; path: (string | number)[] }): void },
): Omit<T, "control"> & { control?: StageControl | null } {
  const { control, ...rest } = input;
  if (control === undefined) return rest;
  if (!input.stage) {
    ctx.addIssue({ code: "custom", message: "Send the stage together with its control.", path: ["control"] });
    return rest;
  }
  const r = readControl(input.stage, control);
  if (!r.ok) {
    ctx.addIssue({ code: "custom", message: r.message, path: r.field.split(".") });
    return rest;
  }
  return { ...rest, control: r.control };
}
