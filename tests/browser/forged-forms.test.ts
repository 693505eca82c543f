// Cross-site request forgery from a same-site origin (issue 15 point 2): a
// page served from another port of 127.0.0.1 holds auto-submitting forms that
// post to our invitation, comment and decision endpoints while the browser is
// signed in. The session cookie is SameSite=Lax and another port is the same
// site, so the browser does send it (RFC 6265bis, "same-site" compares the
// registrable domain, not the port); the forms must be refused by the origin
// rule (Sec-Fetch-Site "same-site", Fetch Metadata Request Headers) with a 403
// before anything else, and nothing may be created.
// A text/plain form whose field name and value together spell JSON is the
// known trick for a JSON body from a plain form (HTML standard, "text/plain
// encoding algorithm": name=value lines).
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { and, count, eq } from "drizzle-orm";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { comments, invitations, revisions } from "@/db/schema";
import { launch, signInAs } from "../helpers/browser";
import { BASE_URL } from "../helpers/server";
import { makeUser, TEST_PASSWORD } from "../helpers/users";
import { makeRetrofit, makeRevision } from "../integration/field/fixtures";

type Form = { action: string; enctype: string; fields: [string, string][] };
const forms = new Map<string, Form>();

function html(f: Form): string {
  const esc = (s: string) => s.replace(/&/g, "&amp;").replace(/"/g, "&quot;").replace(/</g, "&lt;");
  const inputs = f.fields
    .map(([n, v]) => `<input type="hidden" name="${esc(n)}" value="${esc(v)}">`)
    .join("");
  return `<!doctype html><title>Prize draw</title><form method="POST" action="${esc(f.action)}" enctype="${f.enctype}">${inputs}</form><script>document.forms[0].submit()</script>`;
}

/** A text/plain form posting `json` exactly: the last string value is split at "=". */
function plainJson(json: Record<string, string>): [string, string][] {
  const text = JSON.stringify({ ...json, pad: "" });
  const cut = text.lastIndexOf('""');
  return [[text.slice(0, cut + 1), text.slice(cut + 1)]];
}

let browser: Browser;
let evil: Server;
let evilBase: string;
const tag = Math.random().toString(36).slice(2, 8);
let admin: Awaited<ReturnType<typeof makeUser>>;
let reviewer: Awaited<ReturnType<typeof makeUser>>;
let revisionId: number;

beforeAll(async () => {
  evil = createServer((req, res) => {
    const f = forms.get(req.url ?? "");
    res.writeHead(f ? 200 : 404, { "content-type": "text/html; charset=utf-8" });
    res.end(f ? html(f) : "no such page");
  });
  await new Promise<void>((ok) => evil.listen(0, "127.0.0.1", ok));
  evilBase = `http://127.0.0.1:${(evil.address() as AddressInfo).port}`;
  expect(new URL(evilBase).host).not.toBe(new URL(BASE_URL).host);

  admin = await makeUser("admin");
  reviewer = await makeUser("reviewer");
  const engineer = await makeUser("engineer");
  const rf = await makeRetrofit({ createdBy: engineer.id });
  revisionId = (await makeRevision({ retrofitId: rf.id, userId: engineer.id, state: "awaiting_check" })).id;
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
  await new Promise((ok) => evil?.close(ok));
});

const api = (path: string) => `${BASE_URL}${path}`;
const forgedEmail = (kind: string) => `forged-${kind}-${tag}@example.test`;
const forgedBody = (kind: string) => `Forged comment ${kind} ${tag}`;

const CASES = [
  {
    what: "invitation with the admin role, text/plain JSON",
    as: () => admin,
    form: (): Form => ({
      action: api("/api/v1/invitations"),
      enctype: "text/plain",
      fields: plainJson({ email: forgedEmail("plain"), name: "Forged Admin", role: "admin" }),
    }),
  },
  {
    what: "invitation with the admin role, urlencoded",
    as: () => admin,
    form: (): Form => ({
      action: api("/api/v1/invitations"),
      enctype: "application/x-www-form-urlencoded",
      fields: [
        ["email", forgedEmail("urlencoded")],
        ["name", "Forged Admin"],
        ["role", "admin"],
      ],
    }),
  },
  {
    what: "comment as the reviewer, text/plain JSON",
    as: () => reviewer,
    form: (): Form => ({
      action: api(`/api/v1/revisions/${revisionId}/comments`),
      enctype: "text/plain",
      fields: plainJson({ body: forgedBody("plain") }),
    }),
  },
  {
    what: "comment as the reviewer, urlencoded",
    as: () => reviewer,
    form: (): Form => ({
      action: api(`/api/v1/revisions/${revisionId}/comments`),
      enctype: "application/x-www-form-urlencoded",
      fields: [["body", forgedBody("urlencoded")]],
    }),
  },
  {
    what: "release as the reviewer, text/plain JSON",
    as: () => reviewer,
    form: (): Form => ({
      action: api(`/api/v1/revisions/${revisionId}/decision`),
      enctype: "text/plain",
      fields: plainJson({ decision: "release" }),
    }),
  },
  {
    what: "release as the reviewer, urlencoded",
    as: () => reviewer,
    form: (): Form => ({
      action: api(`/api/v1/revisions/${revisionId}/decision`),
      enctype: "application/x-www-form-urlencoded",
      fields: [["decision", "release"]],
    }),
  },
];

async function nothingCreated() {
  const [inv] = await db
    .select({ n: count() })
    .from(invitations)
    .where(eq(invitations.email, forgedEmail("plain")));
  const [inv2] = await db
    .select({ n: count() })
    .from(invitations)
    .where(eq(invitations.email, forgedEmail("urlencoded")));
  const [com] = await db
    .select({ n: count() })
    .from(comments)
    .where(and(eq(comments.revisionId, revisionId)));
  const [rev] = await db
    .select({ state: revisions.state })
    .from(revisions)
    .where(eq(revisions.id, revisionId));
  return { invitations: inv.n + inv2.n, comments: com.n, state: rev.state };
}

describe("forged forms from another port of this host", () => {
  const sessions = new Map<number, { context: BrowserContext; page: Page }>();
  afterAll(async () => {
    for (const s of sessions.values()) await s.context.close();
  });

  it.each(CASES)("$what is refused by the origin rule and creates nothing", async (c) => {
    const user = c.as();
    let s = sessions.get(user.id);
    if (!s) {
      s = await signInAs(browser, user.email, TEST_PASSWORD);
      sessions.set(user.id, s);
    }
    const path = `/${forms.size}`;
    forms.set(path, c.form());
    const target = new URL(c.form().action).pathname;
    const answer = s.page.waitForResponse(
      (r) => new URL(r.url()).pathname === target && r.request().method() === "POST",
    );
    // The page navigates away at once (the form submits itself): wait for the commit only.
    await s.page.goto(evilBase + path, { waitUntil: "commit" });
    const res = await answer;
    const body = (await res.json()) as { error?: { code: string; message: string } };
    // The forged request carried the session cookie (else it would be a 401):
    // it was refused for its origin, not for a missing sign-in.
    expect((await res.request().allHeaders())["sec-fetch-site"]).toBe("same-site");
    expect(res.status(), JSON.stringify(body)).toBe(403);
    expect(body.error?.code).toBe("forbidden");
    expect(body.error?.message).toMatch(/this site's own pages/);
    expect(await nothingCreated()).toEqual({ invitations: 0, comments: 0, state: "awaiting_check" });
  });

  it("the same browser, on our own page, can still comment (the rule refuses only the forgery)", async () => {
    const s = sessions.get(reviewer.id) ?? (await signInAs(browser, reviewer.email, TEST_PASSWORD));
    sessions.set(reviewer.id, s);
    await s.page.goto("/retrofits");
    const status = await s.page.evaluate(
      async ([id, text]) => {
        const r = await fetch(`/api/v1/revisions/${id}/comments`, {
          method: "POST",
          headers: { "content-type": "application/json" },
          body: JSON.stringify({ body: text }),
        });
        return r.status;
      },
      [revisionId, `Own page comment ${tag}`] as const,
    );
    expect(status).toBe(201);
    expect((await nothingCreated()).comments).toBe(1);
  });
});
