// Releasing for the field or returning for rework. Atomic: the state moves only with
// UPDATE ... WHERE state = 'awaiting_check' AND created_by <> reviewer, so when two
// reviewers decide at once PostgreSQL lets one UPDATE through and the other,
// after waiting for the row lock, matches no row and gets 409. The review row,
// the superseding of older released revisions, the audit event and the mail
// all commit together with the state.
import "server-only";
import { and, desc, eq, gt, inArray, isNull, lt, ne, sql } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
import { reviews, revisions, users } from "@/db/schema";
import { ApiError } from "@/lib/api/errors";
import { recordAudit } from "@/lib/audit";
import type { AuthUser } from "@/lib/auth/guard";
import { releasedMail, decisionMail } from "@/lib/mail/messages";
import { enqueueMail } from "@/lib/mail/outbox";
import { loadRevisionForReview } from "./load";
import { lockLiveRetrofit } from "@/lib/retrofits/live-lock";
import { techniciansOfSite } from "./recipients";
import { releaseOverride, type Override } from "./budget-miss";
import { decideRefusal, type Decision } from "./states";
import { DECISION_STATE, REVIEW_ACTIONS, STATE_WORDS } from "./words";

export async function decideRevision(
  user: AuthUser,
  revisionId: number,
  decision: Decision,
  note = "",
  /** the reason for releasing despite a missed budget; refused without one when a target misses */
  overrideReason = "",
) {
  const result = await db.transaction(async (tx) => {
    const { revision, retrofit, author } = await loadRevisionForReview(revisionId, tx);
    const refusal = decideRefusal(user, revision);
    if (refusal) throw refusal;
    // Decisions on one retrofit queue up here, so superseding sees every release;
    // an archived retrofit takes no decision.
    await lockLiveRetrofit(tx, retrofit.id, `${decision} r${revision.number}`);
    let override: Override | null = null;
    if (decision === "release") {
      const stale = await newerCandidate(tx, retrofit.id, revision.number);
      if (stale) throw stale;
      const [stored] = await tx
        .select({ plans: revisions.plans })
        .from(revisions)
        .where(eq(revisions.id, revisionId));
      const rule = releaseOverride(stored?.plans, overrideReason, revision.number);
      if ("refusal" in rule)
        throw new ApiError("unprocessable", rule.refusal, {
          override: "Give the reason for releasing despite the missed budget.",
        });
      override = rule.override;
    }
    const now = new Date();
    const [moved] = await tx
      .update(revisions)
      .set({ state: DECISION_STATE[decision], decidedBy: user.id, decidedAt: now })
      .where(
        and(
          eq(revisions.id, revisionId),
          eq(revisions.state, "awaiting_check"),
          ne(revisions.createdBy, user.id),
        ),
      )
      .returning({ id: revisions.id });
    if (!moved) throw await lostRace(revisionId, revision.number);

    await tx.insert(reviews).values({
      revisionId,
      reviewerId: user.id,
      decision,
      note,
      overrideReason: override?.reason ?? null,
      overrideTargets: override?.targets ?? null,
    });
    let superseded: number[] = [];
    if (decision === "release")
      superseded = await supersede(tx, retrofit.id, revision.number, revisionId, now);

    await recordAudit(
      {
        actorId: user.id,
        action: REVIEW_ACTIONS[decision],
        subjectType: "revision",
        subjectId: revisionId,
        details: {
          retrofitId: retrofit.id,
          number: revision.number,
          from: "awaiting_check",
          to: DECISION_STATE[decision],
          note,
          superseded,
          ...(override ? { override: { reason: override.reason, targets: override.targets } } : {}),
        },
      },
      tx,
    );
    const reviewer = { name: user.name, email: user.email };
    const overrideMail = override ? { reason: override.reason, missed: override.text } : null;
    await enqueueMail(
      [decisionMail({ revision, retrofit, author, reviewer, decision, note, override: overrideMail })],
      tx,
    );
    if (decision === "release") {
      const technicians = await techniciansOfSite(tx, retrofit.site);
      await enqueueMail(
        releasedMail({ revision, retrofit, technicians, replaces: superseded, note, override: overrideMail }),
        tx,
      );
    }
    return {
      id: revisionId,
      number: revision.number,
      state: DECISION_STATE[decision],
      decidedAt: now,
      superseded,
      override: override ? { reason: override.reason, targets: override.targets } : null,
    };
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
  const state = row ? STATE_WORDS[row.state].toLowerCase() : "changed";
  const by = row?.by ? ` by ${row.by}` : "";
  return new ApiError(
    "conflict",
    `r${number} was decided a moment ago${by}: it is now ${state}. Your decision was not recorded; reload to see it.`,
  );
}

/** Only the newest revision that can be released may become the field
 *  revision: a newer one awaiting check or already released blocks the release
 *  of an older one (returning the older one is still allowed). */
async function newerCandidate(tx: Tx, retrofitId: number, number: number): Promise<ApiError | null> {
  const [newer] = await tx
    .select({ number: revisions.number, state: revisions.state })
    .from(revisions)
    .where(
      and(
        eq(revisions.retrofitId, retrofitId),
        gt(revisions.number, number),
        inArray(revisions.state, ["awaiting_check", "released"]),
      ),
    )
    .orderBy(desc(revisions.number))
    .limit(1);
  if (!newer) return null;
  return new ApiError(
    "conflict",
    `r${newer.number} is newer and ${STATE_WORDS[newer.state].toLowerCase()}; only the newest revision can become the field revision. Release or return r${newer.number}, or return r${number}.`,
  );
}

/** Marks older released revisions superseded; returns their numbers. If a newer
 *  released revision already exists, the one just released is superseded at once. */
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
        eq(revisions.state, "released"),
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
        eq(revisions.state, "released"),
        gt(revisions.number, number),
      ),
    );
  if (newer.n > 0) await tx.update(revisions).set({ supersededAt: now }).where(eq(revisions.id, id));
  return older.map((r) => r.number).sort((a, b) => a - b);
}
