// Wrapper for server actions: checks the role and validates the input with zod
// before the action body runs, so no action can forget either. Returns a plain
// result object that forms can show field by field.
import type { z } from "zod";
import type { Role } from "@/db/schema";
import { toApiError, type FieldErrors } from "@/lib/api/errors";
import { requireUser, type AuthUser } from "./guard";

export type ActionResult<T> =
  { ok: true; data: T } | { ok: false; error: { code: string; message: string; fields?: FieldErrors } };

export function guardedAction<S extends z.ZodType, T>(
  opts: { roles: readonly Role[]; schema: S },
  body: (input: z.infer<S>, user: AuthUser) => Promise<T>,
): (input: unknown) => Promise<ActionResult<T>> {
  return async (input) => {
    try {
      const user = await requireUser({ roles: opts.roles });
      const parsed = opts.schema.parse(input instanceof FormData ? Object.fromEntries(input) : input);
      return { ok: true, data: await body(parsed, user) };
    } catch (err) {
      const e = toApiError(err);
      return {
        ok: false,
        error: { code: e.code, message: e.message, ...(e.fields ? { fields: e.fields } : {}) },
      };
    }
  };
}
