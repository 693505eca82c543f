// Requests that used to end in a 500 or the framework's HTML page: percent
// escapes that do not decode (RFC 3986 section 2.1; the octets must be UTF-8,
// RFC 3629 section 3), a callbackUrl next-auth cannot use (next-auth 4,
// core/lib/assert.js: a path or an http(s) URL) in the query of any /api/auth
// endpoint or in its callback cookie, and two invitations for one e-mail
// accepted at the same moment (the users.email unique index). Each answer is a
// 4xx in our error shape and changes nothing.
import { beforeAll, describe, expect, it } from "vitest";
import { randomBytes } from "node:crypto";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { BASE_URL } from "../../helpers/server";
import { isErrorShape, send } from "./client";
import { fingerprint, makeWorld, type World } from "./world";

let w: World;
beforeAll(async () => {
  w = await makeWorld();
});

// "%E0%A4%A" is a cut three-byte UTF-8 sequence, "%ZZ" no hex, "%C0%AF" an
// overlong "/" (RFC 3629 section 10 forbids it), "%FF" no UTF-8 lead byte.
const BROKEN = ["%E0%A4%A", "%ZZ", "%C0%AF", "%FF", "%"];

describe("percent escapes that do not decode", () => {
  const paths = (id: string) => [
    `/api/v1/revisions/${id}`,
    `/api/v1/retrofits/${id}/revisions`,
    `/api/v1/captures/${id}/plot`,
    `/api/v1/users/${id}`,
    `/api/v1/nothing/${id}`,
  ];
  it.each(BROKEN)("in a dynamic segment: %s", async (bad) => {
    const state = await fingerprint(w);
    for (const path of paths(bad)) {
      const res = await send(w, "admin", "GET", { path });
      expect(res.status, `${path}: ${res.text.slice(0, 120)}`).toBe(400);
      expect(isErrorShape(res.body), path).toBe(true);
    }
    const del = await send(w, "admin", "DELETE", { path: `/api/v1/tokens/${bad}` });
    expect(del.status).toBe(400);
    expect(await fingerprint(w)).toBe(state);
  });

  it.each(BROKEN)("in a file path: %s", async (bad) => {
    const res = await send(w, "admin", "GET", {
      path: `/api/v1/revisions/${w.revision.released}/files/${bad}`,
    });
    expect(res.status, res.text.slice(0, 120)).toBe(400);
    expect(isErrorShape(res.body)).toBe(true);
  });

  // Decoded once by the router; a second decode turned these into a URIError
  // (500) or a slash that was never in the request.
  it.each(["%25E0", "%25ZZ", "src%252Fmain.c"])(
    "escaped percent signs are names, not escapes: %s",
    async (p) => {
      const res = await send(w, "admin", "GET", {
        path: `/api/v1/revisions/${w.revision.released}/files/${p}`,
      });
      expect(res.status, res.text.slice(0, 120)).toBe(404);
      expect(isErrorShape(res.body)).toBe(true);
    },
  );
});

describe("callbackUrl next-auth cannot use", () => {
  const ENDPOINTS = ["session", "csrf", "providers", "signin", "signout", "callback/credentials", "error"];
  const BAD = ["%E0%A4%A", "javascript:alert(1)", "http://[", "//[", "data:text/html,x"];

  it.each(ENDPOINTS)("in the query of /api/auth/%s", async (endpoint) => {
    for (const bad of BAD) {
      const res = await fetch(`${BASE_URL}/api/auth/${endpoint}?callbackUrl=${bad}`, { redirect: "manual" });
      const text = await res.text();
      expect(res.status, `${endpoint} ${bad}: ${text.slice(0, 120)}`).toBe(400);
      const body = JSON.parse(text);
      expect(isErrorShape(body)).toBe(true);
      expect(body.error.fields).toHaveProperty("callbackUrl");
    }
  });

  // A cookie value whose escapes do not decode never reaches next-auth (the
  // framework's cookie parser skips it), so the cookie cases start at the second.
  it.each(ENDPOINTS)("in the callback cookie on /api/auth/%s: refused and cleared", async (endpoint) => {
    for (const bad of BAD.slice(1)) {
      const res = await fetch(`${BASE_URL}/api/auth/${endpoint}`, {
        headers: { cookie: `next-auth.callback-url=${bad}` },
        redirect: "manual",
      });
      expect(res.status, `${endpoint} ${bad}`).toBe(400);
      expect(isErrorShape(await res.json())).toBe(true);
      expect(res.headers.getSetCookie().join("\n")).toMatch(/next-auth\.callback-url=;.*Max-Age=0/i);
    }
  });

  it("a GET of the credentials callback is a 405, not next-auth's 500", async () => {
    const res = await fetch(`${BASE_URL}/api/auth/callback/credentials`, { redirect: "manual" });
    expect(res.status).toBe(405);
    expect(isErrorShape(await res.json())).toBe(true);
  });

  it("a good callbackUrl still works", async () => {
    const res = await fetch(`${BASE_URL}/api/auth/csrf?callbackUrl=%2Fretrofits`);
    expect(res.status).toBe(200);
  });

  it("a bad callback cookie beside a session is dropped: pages and the API keep working", async () => {
    const s = w.actors.engineer.session;
    const cookie = `${s.cookieHeader()}; next-auth.callback-url=javascript:alert(1)`;
    for (const path of ["/retrofits", "/api/v1/retrofits"]) {
      const res = await fetch(BASE_URL + path, { headers: { cookie }, redirect: "manual" });
      expect(res.status, path).toBe(200);
      expect(res.headers.getSetCookie().join("\n")).toMatch(/next-auth\.callback-url=;.*Max-Age=0/i);
    }
  });
});

describe("invitations for one e-mail accepted at once", () => {
  // Both pass the "already has an account" read together; the users.email
  // unique index decides. Several rounds of three, so that the race is hit
  // (with the unique-violation handling removed, this failed with a 500).
  it(
    "one account per e-mail; every other accept is a 409 in our error shape",
    { timeout: 120_000 },
    async () => {
      for (let round = 0; round < 4; round++) {
        const email = `twin-${randomBytes(4).toString("hex")}@test.invalid`;
        const tokens: string[] = [];
        for (let i = 0; i < 3; i++) {
          const res = await send(w, "admin", "POST", {
            path: "/api/v1/invitations",
            json: { email, name: "Twin Invite", role: "technician", site: null },
          });
          expect(res.status, res.text).toBe(201);
          tokens.push((res.body as { link: string }).link.split("/invite/")[1]);
        }
        const answers = await Promise.all(
          tokens.map((token) =>
            fetch(`${BASE_URL}/api/v1/invitations/accept`, {
              method: "POST",
              headers: { "content-type": "application/json" },
              body: JSON.stringify({ token, password: "long-enough-pass" }),
            }).then(async (r) => ({ status: r.status, body: await r.json() })),
          ),
        );
        expect(answers.map((a) => a.status).sort(), JSON.stringify(answers)).toEqual([201, 409, 409]);
        for (const a of answers.filter((x) => x.status === 409)) expect(isErrorShape(a.body)).toBe(true);
        const rows = await db.select().from(users).where(eq(users.email, email));
        expect(rows).toHaveLength(1);
      }
    },
  );
});
