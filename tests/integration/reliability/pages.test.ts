// Page matrix: every page in routes.ts x every principal, with real sessions.
// Allowed roles get the page; other roles get the "Not allowed" panel and no
// page data; signed-out visitors and disabled accounts are sent to sign-in.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { signedIn, Session } from "../../helpers/server";
import { makeUser, TEST_PASSWORD } from "../../helpers/users";
import { appPages } from "./app-tree";
import { PAGES } from "./routes";
import { makeWorld, ROLE_LIST, type World } from "./world";

type PagePrincipal = (typeof ROLE_LIST)[number] | "signed-out" | "disabled";
const PAGE_PRINCIPALS: PagePrincipal[] = [...ROLE_LIST, "signed-out", "disabled"];

let w: World;
let disabled: Session;
beforeAll(async () => {
  w = await makeWorld();
  // Signed in while enabled, then disabled: the cookie must open nothing.
  const u = await makeUser("admin");
  disabled = await signedIn(u.email, TEST_PASSWORD);
  await db.update(users).set({ disabled: true }).where(eq(users.id, u.id));
});

function sessionOf(as: PagePrincipal): Session {
  if (as === "signed-out") return new Session();
  if (as === "disabled") return disabled;
  return w.actors[as].session;
}

describe("every page has a table entry", () => {
  it("lists each app/**/page.tsx, and nothing that does not exist", () => {
    const served = appPages().map((p) => p.pattern);
    const listed = PAGES.map((p) => p.pattern);
    expect(
      served.filter((p) => !listed.includes(p)),
      "pages without a table entry",
    ).toEqual([]);
    expect(
      listed.filter((p) => !served.includes(p)),
      "table entries without a page",
    ).toEqual([]);
  });
});

describe.each(PAGES)("page $pattern", (p) => {
  it.each(PAGE_PRINCIPALS)("as %s", async (as) => {
    const path = p.path(w);
    const res = await sessionOf(as).fetch(path);
    const html = await res.text();
    const what = `${path} as ${as}: ${res.status}`;
    expect(res.status, what).toBeLessThan(500);
    if (p.allowed === "public") {
      expect(res.status, what).toBeLessThan(400);
      return;
    }
    if (as === "signed-out" || as === "disabled") {
      expect([302, 303, 307, 308], what).toContain(res.status);
      expect(res.headers.get("location") ?? "", what).toMatch(/\/sign-in/);
      return;
    }
    expect(res.status, what).toBe(200);
    const refused = html.includes("Not allowed");
    expect(refused, `${what}: "Not allowed" shown = ${refused}`).toBe(!p.allowed.includes(as));
    // A refused page carries none of the world's data (the retrofit's site name).
    if (refused) expect(html, what).not.toContain(w.site);
  });
});
