// Sends a built request as a principal: a role's API token, the revoked
// token, or nothing at all (signed out).
import { BASE_URL } from "../../helpers/server";
import type { BuiltRequest, Method } from "./routes";
import type { Principal, World } from "./world";

export type Answer = { status: number; text: string; headers: Headers; body: unknown };

export function authHeader(w: World, as: Principal): Record<string, string> {
  if (as === "signed-out") return {};
  const token = as === "revoked-token" ? w.revokedToken : w.actors[as].token;
  return { authorization: `Bearer ${token}` };
}

export async function send(
  w: World,
  as: Principal,
  method: Method,
  req: BuiltRequest,
  init: { body?: BodyInit; type?: string; headers?: Record<string, string> } = {},
): Promise<Answer> {
  const headers: Record<string, string> = { ...authHeader(w, as), ...init.headers };
  let body: BodyInit | undefined = init.body;
  if (body === undefined && req.json !== undefined) {
    body = JSON.stringify(req.json);
    headers["content-type"] = "application/json";
  } else if (body === undefined && req.raw) {
    body = req.raw.body;
    headers["content-type"] = req.raw.type;
  }
  if (init.type) headers["content-type"] = init.type;
  let res: Response;
  try {
    res = await fetch(BASE_URL + req.path, { method, headers, body, redirect: "manual" });
  } catch (e) {
    // A server that refused the previous body early closes that kept-alive
    // socket; the next request on it is reset before it is read. Once more on
    // a fresh connection (a second reset is an answer: see the callers).
    if ((e as { cause?: { code?: string } }).cause?.code !== "ECONNRESET") throw e;
    res = await fetch(BASE_URL + req.path, { method, headers, body, redirect: "manual" });
  }
  const buf = Buffer.from(await res.arrayBuffer());
  const text = buf.toString("utf8");
  let parsed: unknown = undefined;
  if ((res.headers.get("content-type") ?? "").includes("json")) {
    try {
      parsed = JSON.parse(text);
    } catch {
      parsed = undefined;
    }
  }
  return { status: res.status, text, headers: res.headers, body: parsed };
}

/** The public error shape: { error: { code, message } } with non-empty strings. */
export function isErrorShape(body: unknown): boolean {
  const e = (body as { error?: { code?: unknown; message?: unknown } } | undefined)?.error;
  return (
    typeof e?.code === "string" && e.code.length > 0 && typeof e.message === "string" && e.message.length > 0
  );
}
