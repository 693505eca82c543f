// Security headers on pages and API answers (next.config.mjs), and the session
// cookie's flags. The cookie carries Secure only when NEXTAUTH_URL is https
// (next-auth's useSecureCookies default); the test server runs on plain http
// on loopback, so Secure must be absent here and the name has no __Secure- prefix.
import { describe, expect, it } from "vitest";
import { BASE_URL, Session } from "../../helpers/server";
import { makeUser, TEST_PASSWORD } from "../../helpers/users";

describe("security headers", () => {
  it.each(["/sign-in", "/api/health", "/api/v1/retrofits"])("%s", async (path) => {
    const res = await fetch(BASE_URL + path, { redirect: "manual" });
    const csp = res.headers.get("content-security-policy") ?? "";
    expect(csp).toMatch(/default-src 'self'/);
    expect(csp).toMatch(/frame-ancestors 'none'/);
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    expect(res.headers.get("x-frame-options")?.toUpperCase()).toBe("DENY");
  });
});

describe("session cookie", () => {
  it("is HttpOnly and SameSite=Lax, Secure only over https", async () => {
    const u = await makeUser("technician");
    const s = new Session();
    const csrf = await s.json<{ csrfToken: string }>("/api/auth/csrf");
    const res = await s.fetch("/api/auth/callback/credentials", {
      method: "POST",
      body: new URLSearchParams({
        csrfToken: csrf.body.csrfToken,
        email: u.email,
        password: TEST_PASSWORD,
        json: "true",
      }),
      headers: { "content-type": "application/x-www-form-urlencoded" },
    });
    const cookie = res.headers.getSetCookie().find((c) => /session-token=/.test(c));
    expect(cookie, "a session cookie is set").toBeDefined();
    expect(cookie).toMatch(/;\s*HttpOnly/i);
    expect(cookie).toMatch(/;\s*SameSite=Lax/i);
    const https = BASE_URL.startsWith("https:");
    expect(/;\s*Secure/i.test(cookie!)).toBe(https);
    expect(cookie!.startsWith("__Secure-")).toBe(https);
  });
});

describe("session expiry", () => {
  it("a session lasts 8 h from sign-in (lib/auth/options.ts), in the cookie and in the session answer", async () => {
    const u = await makeUser("reviewer");
    const s = new Session();
    expect(await s.signIn(u.email, TEST_PASSWORD)).toBeNull();
    const res = await s.json<{ expires: string }>("/api/auth/session");
    const left = Date.parse(res.body.expires) - Date.now();
    // 8 h = 28 800 s; a minute of slack for the request itself.
    expect(Math.abs(left - 8 * 3600 * 1000)).toBeLessThan(60_000);
  });
});
