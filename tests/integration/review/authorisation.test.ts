// Who may submit, comment and decide (product.md "People and roles"): the
// server refuses self-approval, technicians commenting or deciding, and
// engineers deciding, whatever the browser shows.
import { beforeAll, describe, expect, it } from "vitest";
import { signedIn, type Session } from "../../helpers/server";
import { makeUser, TEST_PASSWORD } from "../../helpers/users";
import { generate, makeRetrofit, stateOf } from "./fixtures";

type Err = { error: { code: string; message: string } };

let engineer: Awaited<ReturnType<typeof makeUser>>;
let admin: Awaited<ReturnType<typeof makeUser>>;
let eng: Session, rev: Session, tech: Session, adm: Session;

beforeAll(async () => {
  engineer = await makeUser("engineer");
  admin = await makeUser("admin");
  const reviewer = await makeUser("reviewer");
  const technician = await makeUser("technician");
  [eng, rev, tech, adm] = await Promise.all([
    signedIn(engineer.email, TEST_PASSWORD),
    signedIn(reviewer.email, TEST_PASSWORD),
    signedIn(technician.email, TEST_PASSWORD),
    signedIn(admin.email, TEST_PASSWORD),
  ]);
});

async function submitted(by = engineer.id) {
  const rf = await makeRetrofit();
  const r = await generate(rf.id, by);
  const s = by === admin.id ? adm : eng;
  const res = await s.json(`/api/v1/revisions/${r.id}/submit`, { method: "POST", body: JSON.stringify({}) });
  expect(res.status).toBe(200);
  return r;
}

const decide = (s: Session, id: number, decision: string, note = "") =>
  s.json<Err>(`/api/v1/revisions/${id}/decision`, {
    method: "POST",
    body: JSON.stringify({ decision, note }),
  });

describe("review authorisation", () => {
  it("refuses a self-check: an admin cannot release a revision they generated", async () => {
    const r = await submitted(admin.id);
    const res = await decide(adm, r.id, "release");
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/You generated r1; another reviewer must check it/);
    expect((await stateOf(r.id)).state).toBe("awaiting_check");
  });

  it("refuses a technician commenting or deciding", async () => {
    const r = await submitted();
    const c = await tech.json<Err>(`/api/v1/revisions/${r.id}/comments`, {
      method: "POST",
      body: JSON.stringify({ body: "looks fine" }),
    });
    expect(c.status).toBe(403);
    expect((await decide(tech, r.id, "release")).status).toBe(403);
    expect((await decide(tech, r.id, "return")).status).toBe(403);
    expect((await stateOf(r.id)).state).toBe("awaiting_check");
  });

  it("refuses an engineer deciding, and a reviewer submitting", async () => {
    const r = await submitted();
    const res = await decide(eng, r.id, "release");
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("forbidden");
    const rf = await makeRetrofit();
    const draft = await generate(rf.id, engineer.id);
    expect((await rev.json(`/api/v1/revisions/${draft.id}/submit`, { method: "POST" })).status).toBe(403);
    expect((await stateOf(r.id)).state).toBe("awaiting_check");
    expect((await stateOf(draft.id)).state).toBe("prepared");
  });

  it("lets a reviewer approve another user's revision and an admin decide one they did not generate", async () => {
    const r = await submitted();
    const ok = await decide(rev, r.id, "release", "Registers match the datasheet.");
    expect(ok.status).toBe(200);
    const row = await stateOf(r.id);
    expect(row.state).toBe("released");
    expect(row.decidedAt).not.toBeNull();
    const r2 = await submitted();
    expect((await decide(adm, r2.id, "return", "Use TIMER2.")).status).toBe(200);
  });

  it("decides only from awaiting check: a prepared revision cannot be decided, a decided revision cannot be sent again", async () => {
    const rf = await makeRetrofit();
    const draft = await generate(rf.id, engineer.id);
    const early = await decide(rev, draft.id, "release");
    expect(early.status).toBe(409);
    expect(early.body.error.message).toMatch(/prepared, not awaiting check/);
    await eng.json(`/api/v1/revisions/${draft.id}/submit`, { method: "POST" });
    expect((await decide(rev, draft.id, "return")).status).toBe(200);
    const again = await eng.json<Err>(`/api/v1/revisions/${draft.id}/submit`, { method: "POST" });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/Generate a new revision/);
  });

  it("validates the decision and the comment anchor", async () => {
    const r = await submitted();
    expect((await decide(rev, r.id, "maybe")).status).toBe(400);
    const badFile = await rev.json<Err>(`/api/v1/revisions/${r.id}/comments`, {
      method: "POST",
      body: JSON.stringify({ body: "here", filePath: "no/such/file.c", line: 1 }),
    });
    expect(badFile.status).toBe(422);
    expect(
      (
        await rev.json(`/api/v1/revisions/999999999/comments`, {
          method: "POST",
          body: JSON.stringify({ body: "x" }),
        })
      ).status,
    ).toBe(404);
  });

  it("answers 401 without a session", async () => {
    const r = await submitted();
    const res = await fetch(`${eng.base}/api/v1/revisions/${r.id}/decision`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ decision: "release" }),
    });
    expect(res.status).toBe(401);
  });
});
