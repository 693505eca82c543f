// Wrapper for route handlers: any throw becomes the public error shape.
// Handlers still read top to bottom: validate -> authenticate -> load ->
// authorise -> act.
import { ApiError, toResponse } from "./errors";
import { checkCookieMutation, type BodyType } from "./same-origin";
import { ID_DIGITS, MAX_DB_ID } from "@/lib/validation/id";

type Ctx<P> = { params: Promise<P> };

/** bodyTypes: what a cookie-authenticated mutation may send (JSON unless the route takes uploads). */
export function apiRoute<P = Record<string, string>>(
  handler: (req: Request, ctx: Ctx<P>) => Promise<Response>,
  opts: { bodyTypes?: readonly BodyType[] } = {},
): (req: Request, ctx: Ctx<P>) => Promise<Response> {
  return async (req, ctx) => {
    try {
      checkCookieMutation(req, opts.bodyTypes);
      return await handler(req, ctx);
    } catch (err) {
      return toResponse(err);
    }
  };
}

/** A JSON answer that carries a secret (a new API token, an invitation link):
 *  no browser, proxy or back-button cache may keep it (RFC 9111 section 5.2.2.5). */
export function secretJson(body: unknown, init: { status: number }): Response {
  return Response.json(body, { status: init.status, headers: { "cache-control": "no-store" } });
}

const MAX_JSON_BYTES = 1024 * 1024;

async function readBodyText(req: Request, maxBytes: number): Promise<string> {
  const tooLarge = () => new ApiError("payload_too_large", `The body is larger than ${maxBytes} bytes.`);
  // Refused before reading when Content-Length says so; counted again after.
  if (Number(req.headers.get("content-length") ?? "0") > maxBytes) throw tooLarge();
  const text = await req.text();
  if (Buffer.byteLength(text) > maxBytes) throw tooLarge();
  return text;
}

function parseJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    throw new ApiError("bad_request", "The request body is not valid JSON.");
  }
}

/** The request body as JSON, with clear 400/413 errors for what cannot be read. */
export async function readJson(req: Request, maxBytes = MAX_JSON_BYTES): Promise<unknown> {
  const text = await readBodyText(req, maxBytes);
  if (!text.trim()) throw new ApiError("bad_request", "The request body is empty; send JSON.");
  return parseJson(text);
}

/** Like readJson, for routes whose options are all optional: an empty body is {}. */
export async function readOptionalJson(req: Request, maxBytes = MAX_JSON_BYTES): Promise<unknown> {
  const text = await readBodyText(req, maxBytes);
  return text.trim() ? parseJson(text) : {};
}

/** A positive integer id from a URL segment, or 404. */
export function parseId(raw: string, what: string): number {
  if (!ID_DIGITS.test(raw) || Number(raw) > MAX_DB_ID) {
    throw new ApiError("not_found", `${what} was not found.`);
  }
  return Number(raw);
}
