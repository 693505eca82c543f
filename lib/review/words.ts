// Our own words for where a firmware revision stands and what a reviewer
// decides, taken from how a maintenance team talks about a release for a site:
// the engineer prepares it, a second engineer checks it, and it is either
// released for the field or returned for rework. The same values are used in
// the database, the API, pages, mails and the audit log. The values the API
// used before are still accepted on input for one release (ALIASES below) so
// scripts keep working; nothing outside this file may use them.
export const REVISION_STATES = ["prepared", "awaiting_check", "released", "returned"] as const;
export type RevisionStateWord = (typeof REVISION_STATES)[number];

export const DECISIONS = ["release", "return"] as const;
export type DecisionWord = (typeof DECISIONS)[number];

export const STATE_WORDS: Record<RevisionStateWord, string> = {
  prepared: "Prepared",
  awaiting_check: "Awaiting check",
  released: "Released for field",
  returned: "Returned for rework",
};

/** The state a decision moves a revision to. */
export const DECISION_STATE: Record<DecisionWord, RevisionStateWord> = {
  release: "released",
  return: "returned",
};

export const DECISION_WORDS: Record<DecisionWord, string> = {
  release: "released for the field",
  return: "returned for rework",
};

/** Audit-log action names of the review flow. */
export const REVIEW_ACTIONS = {
  submit: "revision.send-for-check",
  release: "revision.release",
  return: "revision.return",
} as const;

// Deprecated API values, accepted on input until the next API release.
export const STATE_ALIASES: Record<string, RevisionStateWord> = {
  draft: "prepared",
  in_review: "awaiting_check",
  approved: "released",
  changes_requested: "returned",
};
export const DECISION_ALIASES: Record<string, DecisionWord> = {
  approved: "release",
  approve: "release",
  changes_requested: "return",
  request_changes: "return",
};

/** A state value from a request: our word, or an old alias mapped to it. */
export function readState(value: string): RevisionStateWord | undefined {
  if ((REVISION_STATES as readonly string[]).includes(value)) return value as RevisionStateWord;
  return STATE_ALIASES[value];
}

/** A decision value from a request: our word, or an old alias mapped to it. */
export function readDecision(value: string): DecisionWord | undefined {
  if ((DECISIONS as readonly string[]).includes(value)) return value as DecisionWord;
  return DECISION_ALIASES[value];
}
