// Authorisation matrix: every route handler in routes.ts x every principal
// (four roles, signed out, a revoked token of an admin). Allowed principals
// succeed; the rest get 401 (no valid credential) or 403 (role) -- 404 where
// the table says the object is hidden from the role -- with the public error
// shape, and the world's rows are exactly as before.
import { beforeAll, describe, expect, it } from "vitest";
import { appRoutes } from "./app-tree";
import { isErrorShape, send } from "./client";
import { ROUTES, type RouteEntry } from "./routes";
import { fingerprint, makeWorld, PRINCIPALS, type Principal, type World } from "./world";

let w: World;
beforeAll(async () => {
  w = await makeWorld();
});

function expectation(r: RouteEntry, as: Principal): { ok: true } | { ok: false; statuses: number[] } {
  if (r.allowed === "public") return { ok: true };
  if (as === "signed-out" || as === "revoked-token") return { ok: false, statuses: [401] };
  if (r.allowed.includes(as)) return { ok: true };
  return { ok: false, statuses: r.hiddenFrom?.includes(as) ? [404] : [403] };
}

describe("every route handler has a table entry", () => {
  it("lists each exported method of each app/**/route.ts, and nothing that does not exist", () => {
    const served = appRoutes().map((r) => `${r.method} ${r.pattern}`);
    const listed = ROUTES.map((r) => `${r.method} ${r.pattern}`);
    expect(served.length).toBeGreaterThan(20);
    expect(
      served.filter((s) => !listed.includes(s)),
      "routes without a table entry",
    ).toEqual([]);
    expect(
      listed.filter((s) => !served.includes(s)),
      "table entries without a route",
    ).toEqual([]);
    expect(new Set(listed).size, "duplicate table entries").toBe(listed.length);
  });
});

describe.each(ROUTES)("$method $pattern", (r) => {
  it.each(PRINCIPALS)("as %s", async (as) => {
    const req = await r.build(w, as);
    const want = expectation(r, as);
    const before = await fingerprint(w);
    const res = await send(w, as, r.method, req);
    const what = `${r.method} ${req.path} as ${as}: ${res.status} ${res.text.slice(0, 300)}`;
    if (want.ok) {
      if (r.allowed === "public" && !r.ok) {
        expect(res.status, what).toBeLessThan(400);
      } else {
        expect(r.ok ?? [200], what).toContain(res.status);
      }
      return;
    }
    expect(want.statuses, what).toContain(res.status);
    expect(isErrorShape(res.body), what).toBe(true);
    expect(await fingerprint(w), `${what}: rows changed`).toBe(before);
  });
});
