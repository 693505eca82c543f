import Link from "next/link";
import { desc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { revisions } from "@/db/schema";
import { listThreads } from "@/lib/review/comments";
import { toThreadView } from "@/lib/review/thread-view";
import { CommentThread } from "./comment-thread";

/** The retrofit page's comment list: every thread the newest revision shows (its own and the
 *  open ones carried from earlier revisions), open ones first, answerable in place. */
export async function RetrofitThreads({
  retrofitId,
  canComment,
}: {
  retrofitId: number;
  canComment: boolean;
}) {
  const [newest] = await db
    .select({ id: revisions.id, number: revisions.number })
    .from(revisions)
    .where(eq(revisions.retrofitId, retrofitId))
    .orderBy(desc(revisions.number))
    .limit(1);
  const threads = newest ? (await listThreads(newest.id)).map(toThreadView) : [];
  const open = threads.filter((t) => !t.resolvedAt);
  const settled = threads.filter((t) => t.resolvedAt);
  return (
    <section
      aria-labelledby="review-comments-h"
      className="flex flex-col gap-3"
      data-testid="retrofit-comments"
    >
      <h2 id="review-comments-h" className="text-lg font-semibold">
        Review comments{newest ? ` on r${newest.number}` : ""} ({open.length} open, {settled.length} settled)
      </h2>
      {threads.length === 0 && (
        <p className="text-ink-soft">
          No comments. A checker comments on quantities, registers and lines from the compare page.
        </p>
      )}
      {[...open, ...settled].map((t) => (
        <div key={t.id}>
          <CommentThread thread={t} revisionId={newest!.id} canComment={canComment} />
          <Link
            className="text-xs underline"
            href={`/retrofits/${retrofitId}/compare?b=${newest!.id}${t.filePath ? "" : `#thread-${t.id}`}`}
          >
            Open on the compare page
          </Link>
        </div>
      ))}
    </section>
  );
}
