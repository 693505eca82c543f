// Approving or requesting changes. Atomic: the state moves only with
// UPDATE ... WHERE state = 'in_review' AND created_by <> reviewer, so when two
// reviewers decide at once PostgreSQL lets one UPDATE through and the other,
// after waiting for the row lock, matches no row and gets 409. The review row,
// the superseding of older approved revisions, the audit event and the mail
// all commit together with the state.
import "server-only";
import { and, eq, gt, isNull, lt, ne, sql } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
import { retrofits, reviews, revisions, users } from "@/db/schema";
import { ApiError } from "@/lib/api/errors";
import { recordAudit } from "@/lib/audit";
import type { AuthUser } from "@/lib/auth/guard";
import { approvedMail, decisionMail } from "@/lib/mail/messages";
import { enqueueMail } from "@/lib/mail/outbox";
import { loadRevisionForReview } from "./load";
import { techniciansOfSite } from "./recipients";
import { decideRefusal, STATE_LABELS, type Decision } from "./states";

export async function decideRevision(user: AuthUser, revisionId: number, decision: Decision, note = "") {
  const result = await db.transaction(async (tx) => {
    const { revision, retrofit, author } = await loadRevisionForReview(revisionId, tx);
    const refusal = decideRefusal(user, revision);
    if (refusal) throw refusal;
    // Decisions on one retrofit queue up here, so superseding sees every approval.
    await tx.select({ id: retrofits.id }).from(retrofits).where(eq(retrofits.id, retrofit.id)).for("update");
    const now = new Date();
    const [moved] = await tx
      .update(revisions)
      .set({ state: decision, decidedBy: user.id, decidedAt: now })
      .where(
        and(eq(revisions.id, revisionId), eq(revisions.state, "in_review"), ne(revisions.createdBy, user.id)),
      )
      .returning({ id: revisions.id });
    if (!moved) throw await lostRace(revisionId, revision.number);

    await tx.insert(reviews).values({ revisionId, reviewerId: user.id, decision, note });
    let superseded: number[] = [];
    if (decision === "approved")
      superseded = await supersede(tx, retrofit.id, revision.number, revisionId, now);

    await recordAudit(
      {
        actorId: user.id,
        action: decision === "approved" ? "revision.approve" : "revision.request-changes",
        subjectType: "revision",
        subjectId: revisionId,
        details: {
          retrofitId: retrofit.id,
          number: revision.number,
          from: "in_review",
          to: decision,
          note,
          superseded,
        },
      },
      tx,
    );
    const reviewer = { name: user.name, email: user.email };
    await enqueueMail([decisionMail({ revision, retrofit, author, reviewer, decision, note })], tx);
    if (decision === "approved") {
      const technicians = await techniciansOfSite(tx, retrofit.site);
      await enqueueMail(approvedMail({ revision, retrofit, technicians }), tx);
    }
    return { id: revisionId, number: revision.number, state: decision, decidedAt: now, superseded };
  });
  return result;
}

/** The 409 for whoever lost: says who decided first and what. */
async function lostRace(revisionId: number, number: number): Promise<ApiError> {
  const [row] = await db
    .select({ state: revisions.state, by: users.name })
    .from(revisions)
    .leftJoin(users, eq(users.id, revisions.decidedBy))
    .where(eq(revisions.id, revisionId));
  const state = row ? STATE_LABELS[row.state].toLowerCase() : "changed";
  const by = row?.by ? ` by ${row.by}` : "";
  return new ApiError(
    "conflict",
    `r${number} was decided a moment ago${by}: it is now ${state}. Your decision was not recorded; reload to see it.`,
  );
}

/** Marks older approved revisions superseded; returns their numbers. If a newer
 *  approved revision already exists, the one just approved is superseded at once. */
async function supersede(
  tx: Tx,
  retrofitId: number,
  number: number,
  id: number,
  now: Date,
): Promise<number[]> {
  const older = await tx
    .update(revisions)
    .set({ supersededAt: now })
    .where(
      and(
        eq(revisions.retrofitId, retrofitId),
        eq(revisions.state, "approved"),
        lt(revisions.number, number),
        isNull(revisions.supersededAt),
      ),
    )
    .returning({ number: revisions.number });
  const [newer] = await tx
    .select({ n: sql<number>`count(*)`.mapWith(Number) })
    .from(revisions)
    .where(
      and(
        eq(revisions.retrofitId, retrofitId),
        eq(revisions.state, "approved"),
        gt(revisions.number, number),
      ),
    );
  if (newer.n > 0) await tx.update(revisions).set({ supersededAt: now }).where(eq(revisions.id, id));
  return older.map((r) => r.number).sort((a, b) => a - b);
}
