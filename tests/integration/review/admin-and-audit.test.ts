// User administration, invitations and the audit log against the running
// server: role changes take effect at once and are audited; an admin cannot
// demote or disable themselves; an invitation link sets a password exactly
// once; the audit API filters by action and actor and is for admins only.
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { auditEvents } from "@/db/schema";
import { waitForMail } from "../../helpers/mail";
import { Session, signedIn } from "../../helpers/server";
import { makeUser, TEST_PASSWORD } from "../../helpers/users";

type Err = { error: { code: string; message: string; fields?: Record<string, string> } };

let admin: Awaited<ReturnType<typeof makeUser>>;
let adm: Session;

beforeAll(async () => {
  admin = await makeUser("admin");
  adm = await signedIn(admin.email, TEST_PASSWORD);
});

const auditOf = (action: string, subjectId: number) =>
  db
    .select()
    .from(auditEvents)
    .where(and(eq(auditEvents.action, action), eq(auditEvents.subjectId, subjectId)));

describe("user administration", () => {
  it("changes a role, takes effect on the next request, and audits from/to", async () => {
    const u = await makeUser("reviewer");
    const s = await signedIn(u.email, TEST_PASSWORD);
    expect((await s.json("/api/v1/users")).status).toBe(403);
    const res = await adm.json<{ user: { role: string } }>(`/api/v1/users/${u.id}`, {
      method: "PATCH",
      body: JSON.stringify({ role: "admin" }),
    });
    expect(res.status).toBe(200);
    expect(res.body.user.role).toBe("admin");
    expect((await s.json("/api/v1/users")).status).toBe(200);
    const [event] = await auditOf("user.role-change", u.id);
    expect(event.actorId).toBe(admin.id);
    expect(event.details).toMatchObject({ from: "reviewer", to: "admin" });
  });

  it("sets a technician's site and disables an account (its session stops working)", async () => {
    const u = await makeUser("technician");
    const s = await signedIn(u.email, TEST_PASSWORD);
    const site = await adm.json<{ user: { site: string | null } }>(`/api/v1/users/${u.id}`, {
      method: "PATCH",
      body: JSON.stringify({ site: "Tollbridge Works" }),
    });
    expect(site.body.user.site).toBe("Tollbridge Works");
    expect((await auditOf("user.site-change", u.id))[0].details).toMatchObject({
      from: null,
      to: "Tollbridge Works",
    });
    expect(
      (await adm.json(`/api/v1/users/${u.id}`, { method: "PATCH", body: JSON.stringify({ disabled: true }) }))
        .status,
    ).toBe(200);
    expect((await s.json("/api/v1/diff?a=1&b=2")).status).toBe(401);
    expect(await auditOf("user.disable", u.id)).toHaveLength(1);
  });

  it("refuses an admin demoting or disabling themselves, and non-admins changing anyone", async () => {
    const self = await adm.json<Err>(`/api/v1/users/${admin.id}`, {
      method: "PATCH",
      body: JSON.stringify({ role: "engineer" }),
    });
    expect(self.status).toBe(403);
    expect(self.body.error.message).toMatch(/own role/);
    expect(
      (
        await adm.json(`/api/v1/users/${admin.id}`, {
          method: "PATCH",
          body: JSON.stringify({ disabled: true }),
        })
      ).status,
    ).toBe(403);
    const eng = await makeUser("engineer");
    const s = await signedIn(eng.email, TEST_PASSWORD);
    expect(
      (await s.json(`/api/v1/users/${eng.id}`, { method: "PATCH", body: JSON.stringify({ role: "admin" }) }))
        .status,
    ).toBe(403);
    expect(
      (
        await adm.json<Err>(`/api/v1/users/${eng.id}`, {
          method: "PATCH",
          body: JSON.stringify({ role: "boss" }),
        })
      ).status,
    ).toBe(400);
  });
});

describe("invitations", () => {
  it("mails a one-time link that sets a password once, then signs in with the invited role", async () => {
    const email = `invited-${Date.now()}@test.invalid`;
    const res = await adm.json<{ link: string; invitation: { id: number } }>("/api/v1/invitations", {
      method: "POST",
      body: JSON.stringify({ email, name: "Ada Invited", role: "technician", site: "Marrow Hill Reservoir" }),
    });
    expect(res.status).toBe(201);
    const mail = await waitForMail(email, /Your Clockgraft account/, 60_000);
    const token = /\/invite\/([A-Za-z0-9_-]+)/.exec(mail.text)![1];
    expect(res.body.link.endsWith(`/invite/${token}`)).toBe(true);

    const page = await new Session().fetch(`/invite/${token}`);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain(email);

    const short = await new Session().json<Err>("/api/v1/invitations/accept", {
      method: "POST",
      body: JSON.stringify({ token, password: "short" }),
    });
    expect(short.status).toBe(400);
    const ok = await new Session().json<{ user: { role: string } }>("/api/v1/invitations/accept", {
      method: "POST",
      body: JSON.stringify({ token, password: "a-long-pass-4k7" }),
    });
    expect(ok.status).toBe(201);
    expect(ok.body.user.role).toBe("technician");
    const again = await new Session().json<Err>("/api/v1/invitations/accept", {
      method: "POST",
      body: JSON.stringify({ token, password: "another-pass-4k7" }),
    });
    expect(again.status).toBe(404);
    const s = await signedIn(email, "a-long-pass-4k7");
    expect(await s.user()).toMatchObject({ email, role: "technician" });
    expect(await auditOf("invitation.create", res.body.invitation.id)).toHaveLength(1);
  }, 180_000);

  it("refuses inviting an address that already has an account", async () => {
    const res = await adm.json<Err>("/api/v1/invitations", {
      method: "POST",
      body: JSON.stringify({ email: admin.email, name: "Again", role: "engineer" }),
    });
    expect(res.status).toBe(409);
  });
});

describe("audit API", () => {
  it("filters by action and actor, newest first, for admins only", async () => {
    const u = await makeUser("engineer");
    await adm.json(`/api/v1/users/${u.id}`, { method: "PATCH", body: JSON.stringify({ role: "reviewer" }) });
    await adm.json(`/api/v1/users/${u.id}`, { method: "PATCH", body: JSON.stringify({ role: "engineer" }) });
    const res = await adm.json<{
      events: { action: string; actorId: number; subjectId: number; details: { to: string } }[];
    }>(`/api/v1/audit?action=user.role-change&actor=${admin.id}`);
    expect(res.status).toBe(200);
    expect(res.body.events.every((e) => e.action === "user.role-change" && e.actorId === admin.id)).toBe(
      true,
    );
    const mine = res.body.events.filter((e) => e.subjectId === u.id);
    expect(mine.map((e) => e.details.to)).toEqual(["engineer", "reviewer"]);
    const future = await adm.json<{ events: unknown[] }>("/api/v1/audit?from=2999-01-01");
    expect(future.body.events).toEqual([]);
    expect((await adm.json("/api/v1/audit?from=yesterday")).status).toBe(400);
    const tech = await signedIn((await makeUser("technician")).email, TEST_PASSWORD);
    expect((await tech.json("/api/v1/audit")).status).toBe(403);
  });
});
