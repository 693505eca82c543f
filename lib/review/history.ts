// What happened to a revision, oldest first: generation, submission, decisions
// and comments, from the audit log (the one record of who did what, when).
import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { auditEvents, reviews, users } from "@/db/schema";
import { REVIEW_ACTIONS } from "./words";

export async function revisionHistory(revisionId: number) {
  return db
    .select({
      id: auditEvents.id,
      action: auditEvents.action,
      details: auditEvents.details,
      createdAt: auditEvents.createdAt,
      actor: users.name,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .where(and(eq(auditEvents.subjectType, "revision"), eq(auditEvents.subjectId, revisionId)))
    .orderBy(asc(auditEvents.createdAt), asc(auditEvents.id));
}

export async function revisionReviews(revisionId: number) {
  return db
    .select({
      id: reviews.id,
      decision: reviews.decision,
      note: reviews.note,
      overrideReason: reviews.overrideReason,
      createdAt: reviews.createdAt,
      reviewer: users.name,
    })
    .from(reviews)
    .innerJoin(users, eq(users.id, reviews.reviewerId))
    .where(eq(reviews.revisionId, revisionId))
    .orderBy(asc(reviews.createdAt));
}

export const ACTION_LABELS: Record<string, string> = {
  "revision.generate": "generated",
  [REVIEW_ACTIONS.submit]: "sent for checking",
  [REVIEW_ACTIONS.release]: "released for the field",
  [REVIEW_ACTIONS.return]: "returned for rework",
  "revision.download": "downloaded the bundle",
  "comment.add": "commented",
  "comment.reply": "answered a comment",
  "comment.resolve": "marked a comment settled",
  "comment.reopen": "opened a comment again",
};
