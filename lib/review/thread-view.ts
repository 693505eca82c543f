// The JSON-safe form of a comment thread that pages hand to client components.
import type { Thread } from "./comments";

export type ThreadView = Omit<Thread, "createdAt" | "resolvedAt" | "replies"> & {
  createdAt: string;
  resolvedAt: string | null;
  replies: { id: number; body: string; author: string; createdAt: string; revisionNumber: number }[];
};

export function toThreadView(t: Thread): ThreadView {
  return {
    ...t,
    createdAt: t.createdAt.toISOString(),
    resolvedAt: t.resolvedAt?.toISOString() ?? null,
    replies: t.replies.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() })),
  };
}

/** What a carry mark tells the reader, in plain words. */
export const MARK_WORDS = {
  same: "carried over, anchor as it was",
  changed: "carried over, anchor changed",
  gone: "carried over, anchor gone",
} as const;
