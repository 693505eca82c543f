// Revision states and who may move them (product.md "Objects", "People and
// roles"): prepared -> awaiting_check -> released | returned (words in
// ./words.ts). A returned revision is final: the engineer generates a new
// revision, so every revision that was checked keeps exactly what the checker saw.
import type { Role, RevisionState } from "@/db/schema";
import { ApiError } from "@/lib/api/errors";
import { EDIT, REVIEW } from "@/lib/auth/roles";

import { STATE_WORDS, type DecisionWord } from "./words";

export type Decision = DecisionWord;

export const canSubmitFrom = (state: RevisionState) => state === "prepared";
export const canDecideFrom = (state: RevisionState) => state === "awaiting_check";

type Actor = { id: number; role: Role };
type Subject = { number: number; state: RevisionState; createdBy: number };

/** Why `user` may not submit `rev`, or null. */
export function submitRefusal(user: Actor, rev: Subject): ApiError | null {
  if (!EDIT.includes(user.role))
    return new ApiError("forbidden", `The ${user.role} role may not send revisions for checking.`);
  if (!canSubmitFrom(rev.state)) {
    return new ApiError(
      "conflict",
      `r${rev.number} is ${STATE_WORDS[rev.state].toLowerCase()}; only a prepared revision can be sent for checking. Generate a new revision instead.`,
    );
  }
  return null;
}

/** Why `user` may not release or return `rev`, or null. */
export function decideRefusal(user: Actor, rev: Subject): ApiError | null {
  if (!REVIEW.includes(user.role))
    return new ApiError("forbidden", `The ${user.role} role may not release or return revisions.`);
  if (rev.createdBy === user.id) {
    return new ApiError("forbidden", `You generated r${rev.number}; another reviewer must check it.`);
  }
  if (!canDecideFrom(rev.state)) {
    return new ApiError(
      "conflict",
      `r${rev.number} is ${STATE_WORDS[rev.state].toLowerCase()}, not awaiting check; there is nothing to decide.`,
    );
  }
  return null;
}
