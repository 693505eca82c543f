// Values typed by people: a number in SI units, or a string in engineering
// notation (4k7, 100n, 2.2u, "16 MHz") read with the engine's parseEng, so the
// browser form and the server accept exactly the same text. Built with
// "zod/mini", as the rest of what the browser forms validate with.
import * as z from "zod/mini";
import { isEngineError, parseEng, type EngUnit } from "@/lib/engine";
import { customIssue } from "./issue";
import { describe } from "./plain-number";

/** Reads a number or an engineering-notation string; the message names the unit. */
export function readEng(
  value: unknown,
  unit: EngUnit,
): { ok: true; value: number } | { ok: false; message: string } {
  if (typeof value === "number") {
    return Number.isFinite(value) ? { ok: true, value } : { ok: false, message: "Enter a finite number." };
  }
  if (value === undefined || value === null || (typeof value === "string" && value.trim() === ""))
    return { ok: false, message: "Enter a value." };
  // Lists, booleans and objects are never quantities (no coercion: [16] is not 16).
  if (typeof value !== "string")
    return { ok: false, message: `Enter a number or a value such as 4k7 or 10 ms; got ${describe(value)}.` };
  try {
    return { ok: true, value: parseEng(value, unit) };
  } catch (e) {
    if (isEngineError(e)) return { ok: false, message: e.message };
    throw e;
  }
}

/** A required quantity in `unit`; output is the SI number. */
export function engNumber(unit: EngUnit, opts: { positive?: boolean } = {}) {
  return z.transform((raw: unknown, ctx): number => {
    const r = readEng(raw, unit);
    if (!r.ok) {
      customIssue(ctx, r.message);
      return z.NEVER;
    }
    if (opts.positive && !(r.value > 0)) {
      customIssue(ctx, "Must be greater than 0.");
      return z.NEVER;
    }
    return r.value;
  });
}

/** Empty string, null or missing = undefined; otherwise as engNumber. */
export function optionalEngNumber(unit: EngUnit, opts: { positive?: boolean } = {}) {
  return z.transform((raw: unknown, ctx): number | undefined => {
    if (raw === null || raw === undefined || (typeof raw === "string" && raw.trim() === "")) return undefined;
    const r = readEng(raw, unit);
    if (!r.ok) {
      customIssue(ctx, r.message);
      return z.NEVER;
    }
    if (opts.positive && !(r.value > 0)) {
      customIssue(ctx, "Must be greater than 0.");
      return z.NEVER;
    }
    return r.value;
  });
}

// Checkbox values live in ./form-boolean (no engine import, so the facts form
// does not load the engine); re-exported for the callers that read them here.
export { formBoolean } from "./form-boolean";
