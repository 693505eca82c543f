"use client";

import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import { ClientApiError, fetchJson } from "@/lib/client/fetch-json";
import { MARK_WORDS, type ThreadView } from "@/lib/review/thread-view";

const when = (iso: string) => `${iso.slice(0, 16).replace("T", " ")} UTC`;

/** One thread: the first comment with its anchor, carry mark, replies, a reply box and resolve / reopen. */
export function CommentThread(props: { thread: ThreadView; revisionId: number; canComment: boolean }) {
  const t = props.thread;
  const router = useRouter();
  const id = useId();
  const [replying, setReplying] = useState(false);
  const [body, setBody] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function act(url: string, init: RequestInit, done: () => void) {
    setBusy(true);
    setError(null);
    try {
      await fetchJson(url, init);
      done();
      router.refresh();
    } catch (err) {
      setError(
        err instanceof ClientApiError ? err.message : "Not saved. Check the connection and try again.",
      );
    } finally {
      setBusy(false);
    }
  }

  const resolved = t.resolvedAt !== null;
  return (
    <article
      className={`border-l-4 ${resolved ? "border-paper-line" : "border-accent"} bg-paper-raised px-3 py-2 font-sans text-sm`}
      data-testid="comment-thread"
      data-thread={t.id}
      data-anchor={t.anchorKey ?? t.anchorKind}
      data-mark={t.mark ?? undefined}
      data-resolved={resolved || undefined}
      id={`thread-${t.id}`}
    >
      <p className="text-xs text-ink-muted">
        <span className="font-medium text-ink-soft">{t.anchorLabel}</span> · {t.author} · {when(t.createdAt)}
        {t.carried && ` · from r${t.originNumber}`}
        {t.mark && (
          <span
            className={`ml-1 rounded border px-1 ${t.mark === "same" ? "border-paper-line" : "border-hazard text-hazard"}`}
          >
            {MARK_WORDS[t.mark]}
          </span>
        )}
        {resolved && ` · settled by ${t.resolvedBy ?? "someone"}`}
      </p>
      <p className="whitespace-pre-wrap">{t.body}</p>
      {t.replies.length > 0 && (
        <ul className="mt-1 space-y-1 border-l border-paper-line pl-3">
          {t.replies.map((r) => (
            <li key={r.id} data-testid="comment-reply">
              <p className="text-xs text-ink-muted">
                {r.author} · {when(r.createdAt)} · on r{r.revisionNumber}
              </p>
              <p className="whitespace-pre-wrap">{r.body}</p>
            </li>
          ))}
        </ul>
      )}
      {props.canComment && (
        <div className="mt-2 flex flex-wrap gap-2">
          {!resolved && (
            <button type="button" className="btn" onClick={() => setReplying(!replying)}>
              Answer
            </button>
          )}
          <button
            type="button"
            className="btn"
            disabled={busy}
            onClick={() =>
              act(
                `/api/v1/comments/${t.id}`,
                { method: "PATCH", body: JSON.stringify({ resolved: !resolved }) },
                () => setReplying(false),
              )
            }
          >
            {resolved ? "Open again" : "Mark settled"}
          </button>
        </div>
      )}
      {replying && (
        <form
          className="mt-2 space-y-2"
          aria-label={`Answer to the comment on ${t.anchorLabel}`}
          onSubmit={(e) => {
            e.preventDefault();
            void act(
              `/api/v1/revisions/${props.revisionId}/comments`,
              { method: "POST", body: JSON.stringify({ body, parentId: t.id }) },
              () => {
                setBody("");
                setReplying(false);
              },
            );
          }}
        >
          <label htmlFor={id} className="field-label">
            Your answer
          </label>
          <textarea
            id={id}
            className="input min-h-16 font-sans"
            value={body}
            onChange={(e) => setBody(e.target.value)}
            maxLength={4000}
            required
            autoFocus
          />
          <button type="submit" className="btn-primary" disabled={busy || !body.trim()}>
            {busy ? "Saving…" : "Send answer"}
          </button>
        </form>
      )}
      {error && (
        <p role="alert" className="field-error">
          {error}
        </p>
      )}
    </article>
  );
}
