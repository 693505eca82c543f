// Sending a prepared revision for checking. The state moves with a conditional UPDATE
// (WHERE state = 'prepared'), so a double click or two engineers at once submit
// it exactly once; the audit event and the mail to the reviewers are written
// in the same transaction and sent after it commits. A target the emulator did
// not prove needs the author's reason (proof-gate.ts), stored on the row.
import "server-only";
import { and, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { revisions } from "@/db/schema";
import { ApiError } from "@/lib/api/errors";
import { recordAudit } from "@/lib/audit";
import type { AuthUser } from "@/lib/auth/guard";
import { reviewRequestedMail } from "@/lib/mail/messages";
import { enqueueMail } from "@/lib/mail/outbox";
import { loadRevisionForReview } from "./load";
import { activeReviewers } from "./recipients";
import { submitRefusal } from "./states";
import { REVIEW_ACTIONS, STATE_WORDS } from "./words";
import { buildRefusal } from "./build-gate";
import { proofGate } from "./proof-gate";
import { lockLiveRetrofit } from "@/lib/retrofits/live-lock";

export async function submitRevision(
  user: AuthUser,
  revisionId: number,
  note = "",
  unprovenReasonInput?: string,
) {
  const result = await db.transaction(async (tx) => {
    const { revision, retrofit, author } = await loadRevisionForReview(revisionId, tx);
    const refusal = submitRefusal(user, revision);
    if (refusal) throw refusal;
    await lockLiveRetrofit(tx, retrofit.id, `submit r${revision.number}`);
    const unbuilt = buildRefusal(revision);
    if (unbuilt) throw unbuilt;
    const unprovenReason = proofGate(revision, unprovenReasonInput);
    const now = new Date();
    const [moved] = await tx
      .update(revisions)
      .set({ state: "awaiting_check", submittedAt: now, unprovenReason })
      .where(and(eq(revisions.id, revisionId), eq(revisions.state, "prepared")))
      .returning({ id: revisions.id });
    if (!moved) {
      const fresh = await loadRevisionForReview(revisionId, tx);
      throw new ApiError(
        "conflict",
        `r${revision.number} was submitted a moment ago by someone else; it is now ${STATE_WORDS[fresh.revision.state].toLowerCase()}.`,
      );
    }
    await recordAudit(
      {
        actorId: user.id,
        action: REVIEW_ACTIONS.submit,
        subjectType: "revision",
        subjectId: revisionId,
        details: {
          retrofitId: retrofit.id,
          number: revision.number,
          from: "prepared",
          to: "awaiting_check",
          note,
          ...(unprovenReason ? { unprovenReason } : {}),
        },
      },
      tx,
    );
    const reviewers = await activeReviewers(tx, revision.createdBy);
    await enqueueMail(
      reviewRequestedMail({ revision, retrofit, author, reviewers, note, unprovenReason }),
      tx,
    );
    return { id: revisionId, number: revision.number, state: "awaiting_check" as const, submittedAt: now };
  });
  return result;
}
