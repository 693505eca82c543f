// Values typed by people: a number in SI units, or a string in engineering
// notation (4k7, 100n, 2.2u, "16 MHz") read with the engine's parseEng, so the
// browser form and the server accept exactly the same text.
import { z } from "zod";
import { isEngineError, parseEng, type EngUnit } from "@/lib/engine";
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
  return z.unknown().transform((raw, ctx) => {
    const r = readEng(raw, unit);
    if (!r.ok) {
      ctx.addIssue({ code: "custom", message: r.message });
      return z.NEVER;
    }
    if (opts.positive && !(r.value > 0)) {
      ctx.addIssue({ code: "custom", message: "Must be greater than 0." });
      return z.NEVER;
    }
    return r.value;
  });
}

/** Empty string, null or missing = undefined; otherwise as engNumber. */
export function optionalEngNumber(unit: EngUnit, opts: { positive?: boolean } = {}) {
  return z.unknown().transform((raw, ctx): number | undefined => {
    if (raw === null || raw === undefined || (typeof raw === "string" && raw.trim() === "")) return undefined;
    const r = readEng(raw, unit);
    if (!r.ok) {
      ctx.addIssue({ code: "custom", message: r.message });
      return z.NEVER;
    }
    if (opts.positive && !(r.value > 0)) {
      ctx.addIssue({ code: "custom", message: "Must be greater than 0." });
      return z.NEVER;
    }
    return r.value;
  });
}

/** Checkbox values: real booleans, or the strings forms send. */
export const formBoolean = z
  .union([z.boolean(), z.enum(["true", "false", "on", "off", ""])])
  .optional()
  .transform((v) => v === true || v === "true" || v === "on");
