// Runs before every route (Next.js proxy):
//  - API paths with a percent escape that does not decode get our JSON 400
//    (the router would answer with its own HTML page);
//  - a callbackUrl next-auth cannot use (query on /api/auth, or the callback
//    cookie anywhere) is refused on /api/auth and dropped elsewhere, because
//    next-auth answers it with a 500 on every session read;
//  - pages get a fresh CSP nonce (lib/api/csp.ts) and Cache-Control: no-store;
//  - signed-out visitors of app pages are sent to the sign-in page.
// Authorisation is not done here: every handler, action and page checks the role itself.
import { NextResponse, type NextFetchEvent, type NextRequest } from "next/server";
import { withAuth, type NextRequestWithAuth } from "next-auth/middleware";
import { NON_PAGE_POLICY, newNonce, pagePolicy } from "@/lib/api/csp";
import { brokenEscapeSegment } from "@/lib/api/url-escapes";
import { CALLBACK_COOKIES, usableCallbackUrl } from "@/lib/auth/callback-url";

const DEV = process.env.NODE_ENV !== "production";
const PUBLIC_PAGES = /^\/(sign-in|invite)(\/|$)/;

function jsonError(status: number, code: string, message: string, fields?: Record<string, string>) {
  return NextResponse.json({ error: { code, message, ...(fields ? { fields } : {}) } }, { status });
}

function badCallbackCookies(req: NextRequest): string[] {
  return CALLBACK_COOKIES.filter((name) => {
    const value = req.cookies.get(name)?.value;
    return value !== undefined && value !== "" && !usableCallbackUrl(value);
  });
}

function expire(res: NextResponse, names: string[]): NextResponse {
  for (const name of names) res.cookies.set(name, "", { path: "/", maxAge: 0 });
  return res;
}

/** The request headers passed on: bad callback cookies removed, the page's CSP added. */
function forwardedHeaders(req: NextRequest, drop: string[], csp?: string): Headers {
  const headers = new Headers(req.headers);
  if (drop.length) {
    const kept = req.cookies
      .getAll()
      .filter((c) => !drop.includes(c.name))
      .map((c) => `${c.name}=${encodeURIComponent(c.value)}`);
    if (kept.length) headers.set("cookie", kept.join("; "));
    else headers.delete("cookie");
  }
  if (csp) headers.set("content-security-policy", csp);
  return headers;
}

function pageResponse(req: NextRequest, drop: string[]): NextResponse {
  const csp = pagePolicy(newNonce(), DEV);
  const res = NextResponse.next({ request: { headers: forwardedHeaders(req, drop, csp) } });
  res.headers.set("content-security-policy", csp);
  // Pages show signed-in data; no shared or back-button cache may keep them.
  res.headers.set("cache-control", "no-store");
  return expire(res, drop);
}

const signedInPages = withAuth((req: NextRequestWithAuth) => pageResponse(req, badCallbackCookies(req)), {
  pages: { signIn: "/sign-in" },
});

export default async function proxy(req: NextRequest, event: NextFetchEvent) {
  const path = req.nextUrl.pathname;
  const drop = badCallbackCookies(req);
  if (path.startsWith("/api/")) {
    const broken = brokenEscapeSegment(path);
    if (broken !== null)
      return jsonError(
        400,
        "bad_request",
        `The address has a percent escape that does not decode: "${broken.slice(0, 80)}".`,
        { path: "Percent escapes must be % and two hex digits forming UTF-8." },
      );
    if (path.startsWith("/api/auth/")) {
      const callbackUrl = req.nextUrl.searchParams.get("callbackUrl");
      if (callbackUrl !== null && callbackUrl !== "" && !usableCallbackUrl(callbackUrl))
        return jsonError(
          400,
          "bad_request",
          "callbackUrl must be a path on this site or an http(s) address.",
          {
            callbackUrl: "Not a path or an http(s) address.",
          },
        );
      if (drop.length)
        return expire(
          jsonError(
            400,
            "bad_request",
            "The sign-in return address cookie was not usable and has been cleared; try again.",
            {
              [drop[0]]: "Not a path or an http(s) address.",
            },
          ),
          drop,
        );
      // next-auth answers a GET of the credentials callback with a 500 ("not supported").
      if (path === "/api/auth/callback/credentials" && req.method !== "POST")
        return jsonError(405, "method_not_allowed", "Sign in with a POST from the sign-in page.");
    }
    const res = drop.length
      ? expire(NextResponse.next({ request: { headers: forwardedHeaders(req, drop) } }), drop)
      : NextResponse.next();
    res.headers.set("content-security-policy", NON_PAGE_POLICY);
    return res;
  }
  if (PUBLIC_PAGES.test(path)) return pageResponse(req, drop);
  return signedInPages(req as NextRequestWithAuth, event);
}

// The capture upload (exactly /api/v1/captures) is left out: the framework
// buffers a request body for the proxy, which would hold a whole 64 MiB upload
// in memory before the route streams and measures it (lib/field/upload.ts).
// That route checks its own session and origin (apiRoute) and has no escapes
// in its path to check.
export const config = {
  matcher: ["/((?!_next|favicon.ico|fonts|api/v1/captures$).*)"],
};
