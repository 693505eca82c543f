// Revision state as words with a quiet border; never colour alone.
import type { RevisionState } from "@/db/schema";
import { STATE_WORDS } from "@/lib/review/words";

const TONE: Record<RevisionState, string> = {
  prepared: "border-paper-line text-ink-soft",
  awaiting_check: "border-accent text-ink",
  released: "border-ok text-ink",
  returned: "border-hazard text-ink",
};

export function StateBadge({ state, superseded }: { state: RevisionState; superseded?: boolean }) {
  return (
    <span className={`inline-block rounded border px-1.5 py-0.5 text-xs font-medium ${TONE[state]}`}>
      {STATE_WORDS[state]}
      {superseded ? " (superseded)" : ""}
    </span>
  );
}
