import type { RevisionState } from "@/db/schema";
import { STATE_WORDS } from "@/lib/review/words";

// Revision state as words; the colour only repeats them. One badge for every
// page that names a revision state.
const STYLE: Record<RevisionState, string> = {
  prepared: "border-paper-line bg-paper-sunk text-ink-soft",
  awaiting_check: "border-accent bg-accent-soft text-accent-strong",
  released: "border-ok bg-ok-soft text-ok",
  returned: "border-hazard bg-hazard-soft text-hazard",
};

export function StateBadge({ state, superseded }: { state: RevisionState; superseded?: boolean }) {
  return (
    <span
      className={`inline-block rounded border px-2 py-0.5 text-xs font-medium ${STYLE[state]}`}
      data-testid="revision-state"
    >
      {STATE_WORDS[state]}
      {superseded ? " · superseded" : ""}
    </span>
  );
}
