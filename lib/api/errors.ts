// One error shape for every API response: { error: { code, message, fields? } }.
// Route handlers throw ApiError (or let zod, engine and capture errors reach
// toResponse); anything else is logged and answered with a safe 500.
import { core } from "zod";
import { EngineError } from "@/lib/engine/errors";

export type ApiErrorCode =
  | "bad_request"
  | "unauthenticated"
  | "forbidden"
  | "not_found"
  | "method_not_allowed"
  | "conflict"
  | "payload_too_large"
  | "unsupported_media_type"
  | "unprocessable"
  | "too_many_requests"
  | "unavailable"
  | "internal";

const STATUS: Record<ApiErrorCode, number> = {
  bad_request: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  method_not_allowed: 405,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  unprocessable: 422,
  too_many_requests: 429,
  unavailable: 503,
  internal: 500,
};

export type FieldErrors = Record<string, string>;

export class ApiError extends Error {
  readonly code: ApiErrorCode;
  readonly fields?: FieldErrors;

  constructor(code: ApiErrorCode, message: string, fields?: FieldErrors) {
    super(message);
    this.name = "ApiError";
    this.code = code;
    this.fields = fields;
  }

  get status(): number {
    return STATUS[this.code];
  }
}

export const notFound = (what: string) => new ApiError("not_found", `${what} was not found.`);
export const forbidden = (why = "Your role does not allow this.") => new ApiError("forbidden", why);

/** Field-level messages from a zod error (classic or "zod/mini"), keyed by dotted path. */
export function zodFields(error: core.$ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.join(".") || "_";
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}

/** Anything thrown inside a handler, as the public error shape and status. */
export function toApiError(err: unknown): ApiError {
  if (err instanceof ApiError) return err;
  // core.$ZodError matches classic zod's errors and those of "zod/mini" schemas.
  if (err instanceof core.$ZodError) {
    return new ApiError("bad_request", "Some fields are not valid.", zodFields(err));
  }
  if (err instanceof EngineError) {
    return new ApiError("unprocessable", err.message, err.field ? { [err.field]: err.message } : undefined);
  }
  if (isNamedError(err, "CaptureError")) {
    const code = (err as { code?: string }).code;
    return new ApiError(code === "too-large" ? "payload_too_large" : "unprocessable", err.message);
  }
  if (isUnstorableText(err)) {
    // PostgreSQL text cannot hold a NUL character (SQLSTATE 22021, 22P05).
    return new ApiError("bad_request", "Text may not contain NUL (zero) characters.");
  }
  if (isUniqueViolation(err)) {
    // Two requests raced to create the same row (SQLSTATE 23505); the loser is told so.
    return new ApiError(
      "conflict",
      "That already exists (another request just created it). Reload and check.",
    );
  }
  if (isConnectionError(err)) {
    console.error("database unavailable:", (err as Error).message);
    return new ApiError("unavailable", "The database is not reachable right now. Try again in a moment.");
  }
  console.error("unexpected error:", err);
  return new ApiError("internal", "Something went wrong on the server. The error has been logged.");
}

export function toResponse(err: unknown): Response {
  const e = toApiError(err);
  const body = { error: { code: e.code, message: e.message, ...(e.fields ? { fields: e.fields } : {}) } };
  return Response.json(body, { status: e.status });
}

function isNamedError(err: unknown, name: string): err is Error {
  return err instanceof Error && err.name === name;
}

function isConnectionError(err: unknown): boolean {
  // Walk the cause chain: a transaction broken by a server restart surfaces as
  // "Failed query: rollback" whose cause is pg's "not queryable" client error.
  for (
    let e = err as { code?: unknown; message?: unknown; cause?: unknown } | undefined, i = 0;
    e && i < 6;
    i++
  ) {
    const code = typeof e.code === "string" ? e.code : "";
    if (
      code === "ECONNREFUSED" ||
      code === "ECONNRESET" ||
      code === "57P01" ||
      code === "57P03" ||
      code.startsWith("08")
    )
      return true;
    if (
      typeof e.message === "string" &&
      /connection terminated|not queryable|connection error/i.test(e.message)
    )
      return true;
    e = e.cause as typeof e;
  }
  return false;
}

/** A unique constraint refused a row (SQLSTATE 23505), directly or as the cause of a failed query. */
export function isUniqueViolation(err: unknown): boolean {
  const e = err as { code?: string; cause?: { code?: string } } | null;
  return (e?.code ?? e?.cause?.code) === "23505";
}

function isUnstorableText(err: unknown): boolean {
  const e = err as { code?: string; cause?: { code?: string } } | null;
  const code = e?.code ?? e?.cause?.code;
  return code === "22021" || code === "22P05";
}
