"use client";
// A small button at the end of a board or register row: opens the anchored
// comment form below the tables with this row's quantity or register chosen.
import { useCommentAnchor } from "./comment-anchor-context";

export function CommentRowButton({ anchorKey, label }: { anchorKey: string; label: string }) {
  const chosen = useCommentAnchor();
  if (!chosen) return null;
  const current = chosen.key === anchorKey;
  return (
    <button
      type="button"
      className="rounded border border-paper-line px-1.5 py-0.5 text-xs text-ink-soft hover:bg-paper-sunk"
      aria-label={`Comment on ${label}`}
      aria-pressed={current}
      data-comment-anchor={anchorKey}
      onClick={() => chosen.choose(anchorKey)}
    >
      Comment
    </button>
  );
}
