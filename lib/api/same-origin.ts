// Cross-site request forgery guard for cookie-authenticated mutations.
// A browser attaches the session cookie to a form another site (or another
// port on this host: same-site, not same-origin) submits, so a cookie alone
// proves nothing. A mutation signed in by cookie must therefore
//  - come from our own origin: Sec-Fetch-Site "same-origin" when the browser
//    sends it (Fetch Metadata), else an Origin header whose host is this
//    request's Host; with neither it is refused (every current browser sends
//    Origin on a cross-origin or non-GET request, RFC 6454 section 7 and the
//    Fetch standard), and
//  - carry a JSON body (Content-Type application/json), which an HTML form
//    cannot send; routes that take a file upload name multipart instead.
// Bearer-token requests carry no ambient credential and are not checked.
// Next 16 server actions compare Origin with Host themselves (this app has
// none: guardedAction is ready for them and runs requireUser).
import { ApiError } from "./errors";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

// text/csv and tab-separated values are raw capture uploads; a plain HTML form
// cannot send them (forms send urlencoded, multipart or text/plain only).
export type BodyType = "application/json" | "multipart/form-data" | "text/csv" | "text/tab-separated-values";

function mediaType(header: string | null): string | null {
  if (header === null) return null;
  return header.split(";")[0].trim().toLowerCase();
}

function hasBody(req: Request): boolean {
  const length = req.headers.get("content-length");
  return req.headers.has("transfer-encoding") || (length !== null && length !== "0");
}

/** Throws 403 (wrong or missing origin) or 415 (not a JSON body, RFC 9110 section 15.5.16) for a forged cookie mutation. */
export function checkCookieMutation(
  req: Request,
  bodyTypes: readonly BodyType[] = ["application/json"],
): void {
  if (SAFE_METHODS.has(req.method.toUpperCase())) return;
  if (req.headers.get("authorization")?.startsWith("Bearer ")) return;
  // Without a session cookie the request is signed out and gets its 401 later.
  if (!/(^|;\s*)(__Secure-)?next-auth\.session-token(\.\d+)?=/.test(req.headers.get("cookie") ?? "")) return;
  const site = req.headers.get("sec-fetch-site");
  if (site !== null) {
    if (site.toLowerCase() !== "same-origin")
      throw new ApiError(
        "forbidden",
        `Changes signed in by cookie must come from this site's own pages (Sec-Fetch-Site was "${site}"). Scripts use an API token.`,
      );
  } else {
    const origin = req.headers.get("origin");
    let host: string | null = null;
    try {
      host = origin && origin !== "null" ? new URL(origin).host : null;
    } catch {
      host = null;
    }
    if (!host || host !== req.headers.get("host"))
      throw new ApiError(
        "forbidden",
        origin
          ? `Changes signed in by cookie must come from this site's own pages (Origin was ${origin}). Scripts use an API token.`
          : "Changes signed in by cookie need an Origin header from this site's own pages. Scripts use an API token.",
      );
  }
  const type = mediaType(req.headers.get("content-type"));
  if (type === null && !hasBody(req)) return;
  if (!type || !(bodyTypes as readonly string[]).includes(type))
    throw new ApiError(
      "unsupported_media_type",
      `Content-Type must be ${bodyTypes.join(" or ")} for this request, got ${type ?? "none"}.`,
      { "content-type": `Send ${bodyTypes.join(" or ")}.` },
    );
}
