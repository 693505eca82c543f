// Two reviewers deciding on one revision at the same moment: the conditional
// UPDATE lets exactly one through (200) and the other gets 409 with a message
// that says who won; state, review rows and audit events stay consistent.
// A newer released revision supersedes the older released one.
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { auditEvents, reviews } from "@/db/schema";
import { DECISION_STATE } from "@/lib/review/words";
import { signedIn, type Session } from "../../helpers/server";
import { makeUser, TEST_PASSWORD } from "../../helpers/users";
import { generate, makeRetrofit, setStageValue, stateOf } from "./fixtures";

type Body = { error?: { code: string; message: string }; revision?: { state: string } };

let engineerId: number;
let eng: Session, r1: Session, r2: Session;

beforeAll(async () => {
  const engineer = await makeUser("engineer");
  const a = await makeUser("reviewer");
  const b = await makeUser("reviewer");
  engineerId = engineer.id;
  [eng, r1, r2] = await Promise.all([
    signedIn(engineer.email, TEST_PASSWORD),
    signedIn(a.email, TEST_PASSWORD),
    signedIn(b.email, TEST_PASSWORD),
  ]);
});

async function inReview(retrofitId?: number) {
  const rfId = retrofitId ?? (await makeRetrofit()).id;
  const rev = await generate(rfId, engineerId);
  expect((await eng.json(`/api/v1/revisions/${rev.id}/submit`, { method: "POST" })).status).toBe(200);
  return rev;
}

const decide = (s: Session, id: number, decision: string) =>
  s.json<Body>(`/api/v1/revisions/${id}/decision`, { method: "POST", body: JSON.stringify({ decision }) });

describe("concurrent decisions", () => {
  it("gives exactly one 200 and one 409 when two reviewers decide at once, every time", async () => {
    for (let round = 0; round < 6; round++) {
      const rev = await inReview();
      // Opposite decisions, so the final state tells which one won.
      const [x, y] = await Promise.all([decide(r1, rev.id, "release"), decide(r2, rev.id, "return")]);
      const statuses = [x.status, y.status].sort();
      expect(statuses).toEqual([200, 409]);
      const winner = x.status === 200 ? x : y;
      const loser = x.status === 200 ? y : x;
      expect(loser.body.error?.code).toBe("conflict");
      // Two ways to lose, both a 409 naming the state: decided while this request waited for the
      // row lock, or already decided when this request read the revision (it came in later).
      expect(loser.body.error?.message).toMatch(
        /was decided a moment ago by Test reviewer: it is now (released for field|returned for rework)|is (released for field|returned for rework), not awaiting check/,
      );
      const row = await stateOf(rev.id);
      expect(row.state).toBe(winner.body.revision?.state);
      const rows = await db.select().from(reviews).where(eq(reviews.revisionId, rev.id));
      expect(rows).toHaveLength(1);
      expect(DECISION_STATE[rows[0].decision]).toBe(row.state);
      const events = await db
        .select()
        .from(auditEvents)
        .where(and(eq(auditEvents.subjectType, "revision"), eq(auditEvents.subjectId, rev.id)));
      expect(
        events.filter((e) => e.action === "revision.release" || e.action === "revision.return"),
      ).toHaveLength(1);
    }
  });

  it("supersedes the older released revision when a newer one is released", async () => {
    const rf = await makeRetrofit();
    const first = await inReview(rf.id);
    expect((await decide(r1, first.id, "release")).status).toBe(200);
    await setStageValue(rf.id, "rb", 4.7e3);
    const second = await inReview(rf.id);
    expect((await stateOf(first.id)).supersededAt).toBeNull();
    expect((await decide(r2, second.id, "release")).status).toBe(200);
    expect((await stateOf(first.id)).supersededAt).not.toBeNull();
    expect((await stateOf(second.id)).supersededAt).toBeNull();
  });
});
