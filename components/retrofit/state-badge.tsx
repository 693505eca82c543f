// Revision state as words with a quiet border; never colour alone.
import type { RevisionState } from "@/db/schema";

const LABEL: Record<RevisionState, string> = {
  draft: "Draft",
  in_review: "In review",
  approved: "Approved",
  changes_requested: "Changes requested",
};

const TONE: Record<RevisionState, string> = {
  draft: "border-paper-line text-ink-soft",
  in_review: "border-accent text-ink",
  approved: "border-ok text-ink",
  changes_requested: "border-hazard text-ink",
};

export function StateBadge({ state, superseded }: { state: RevisionState; superseded?: boolean }) {
  return (
    <span className={`inline-block rounded border px-1.5 py-0.5 text-xs font-medium ${TONE[state]}`}>
      {LABEL[state]}
      {superseded ? " (superseded)" : ""}
    </span>
  );
}

export const STATE_LABEL = LABEL;
