// Revision states and who may move them (product.md "Objects", "People and
// roles"): draft -> in_review -> approved | changes_requested. A revision with
// changes requested is final: the engineer generates a new revision, so every
// revision that was reviewed keeps exactly what the reviewer saw.
import type { Role, RevisionState } from "@/db/schema";
import { ApiError } from "@/lib/api/errors";
import { EDIT, REVIEW } from "@/lib/auth/roles";

export type Decision = "approved" | "changes_requested";

export const STATE_LABELS: Record<RevisionState, string> = {
  draft: "Draft",
  in_review: "In review",
  approved: "Approved",
  changes_requested: "Changes requested",
};

export const canSubmitFrom = (state: RevisionState) => state === "draft";
export const canDecideFrom = (state: RevisionState) => state === "in_review";

type Actor = { id: number; role: Role };
type Subject = { number: number; state: RevisionState; createdBy: number };

/** Why `user` may not submit `rev`, or null. */
export function submitRefusal(user: Actor, rev: Subject): ApiError | null {
  if (!EDIT.includes(user.role))
    return new ApiError("forbidden", `The ${user.role} role may not submit revisions.`);
  if (!canSubmitFrom(rev.state)) {
    return new ApiError(
      "conflict",
      `r${rev.number} is ${STATE_LABELS[rev.state].toLowerCase()}; only a draft can be submitted. Generate a new revision instead.`,
    );
  }
  return null;
}

/** Why `user` may not approve or request changes on `rev`, or null. */
export function decideRefusal(user: Actor, rev: Subject): ApiError | null {
  if (!REVIEW.includes(user.role))
    return new ApiError("forbidden", `The ${user.role} role may not decide on revisions.`);
  if (rev.createdBy === user.id) {
    return new ApiError("forbidden", `You generated r${rev.number}; another reviewer must decide on it.`);
  }
  if (!canDecideFrom(rev.state)) {
    return new ApiError(
      "conflict",
      `r${rev.number} is ${STATE_LABELS[rev.state].toLowerCase()}, not in review; there is nothing to decide.`,
    );
  }
  return null;
}
