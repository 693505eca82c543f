// Plain numbers in JSON bodies, read strictly. z.coerce runs Number() on
// whatever arrives, so [16] became 16, true became 1 and "0x10" became 16:
// a broken client was silently "understood". Here a number field takes a JSON
// number, or (from the browser forms, which send text) a string written as a
// plain decimal: optional sign, digits with an optional fraction and an
// optional exponent. Everything else is refused, and zod puts the message on
// the field's path, so the 400 names the field. Built with "zod/mini" (the
// target schema reaches the browser); `check` may be any zod number schema.
import * as z from "zod/mini";
import type { core } from "zod/mini";
import { customIssue } from "./issue";

/** A plain decimal as text: "2", "-0.5", "1e-3", ".5"; no hex, no spaces inside, no thousands separators. */
export const PLAIN_DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** The number a JSON value stands for, or null when it is not a plain number. */
export function readPlainNumber(raw: unknown): number | null {
  if (typeof raw === "number") return Number.isFinite(raw) ? raw : null;
  if (typeof raw !== "string") return null;
  const s = raw.trim();
  if (!PLAIN_DECIMAL.test(s)) return null;
  const v = Number(s);
  return Number.isFinite(v) ? v : null;
}

const blank = (v: unknown) => v === undefined || v === null || (typeof v === "string" && v.trim() === "");

function strict(what: string) {
  return z.transform((raw: unknown, ctx): number => {
    const v = readPlainNumber(raw);
    if (v === null) {
      customIssue(ctx, `${what}; got ${describe(raw)}.`);
      return z.NEVER;
    }
    return v;
  });
}

type NumberCheck = core.$ZodType<number, number>;

/**
 * A required number field: a JSON number or plain decimal text, then `check`
 * (ranges, whole numbers). `what` names the quantity in the message
 * ("Clock accuracy is a number in ppm; got true.").
 */
export function plainNumber(what: string, check: NumberCheck = z.number()) {
  return z.pipe(strict(what), check);
}

/** As plainNumber, but blank (missing, null, "") is undefined. */
export function optionalPlainNumber(what: string, check: NumberCheck = z.number()) {
  return z.optional(
    z.pipe(
      z.transform((raw: unknown) => (blank(raw) ? undefined : raw)),
      z.optional(z.pipe(strict(what), check)),
    ),
  );
}

/** What was sent, short, for the message: `an array`, `true`, `"0x10"`. */
export function describe(raw: unknown): string {
  if (Array.isArray(raw)) return "a list";
  if (raw === null) return "null";
  if (typeof raw === "object") return "an object";
  if (typeof raw === "string") return JSON.stringify(raw.length > 24 ? `${raw.slice(0, 24)}…` : raw);
  return String(raw);
}
