"use client";

import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import { ClientApiError, fetchJson } from "@/lib/client/fetch-json";

/** Adds a comment to a revision, optionally anchored to a file and line, then refreshes the page. */
export function CommentForm(props: {
  revisionId: number;
  filePath?: string;
  line?: number;
  onDone?: () => void;
  autoFocus?: boolean;
}) {
  const router = useRouter();
  const id = useId();
  const [body, setBody] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const where = props.filePath
    ? `${props.filePath}${props.line ? ` line ${props.line}` : ""}`
    : "this revision";

  async function send(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setError(null);
    try {
      await fetchJson(`/api/v1/revisions/${props.revisionId}/comments`, {
        method: "POST",
        body: JSON.stringify({ body, filePath: props.filePath ?? null, line: props.line ?? null }),
      });
      setBody("");
      props.onDone?.();
      router.refresh();
    } catch (err) {
      setError(
        err instanceof ClientApiError
          ? err.message
          : "The comment was not saved. Check the connection and try again.",
      );
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={send} className="space-y-2" aria-label={`New comment on ${where}`}>
      <label htmlFor={id} className="field-label">
        Comment on {where}
      </label>
      <textarea
        id={id}
        className="input min-h-20 font-sans"
        value={body}
        onChange={(e) => setBody(e.target.value)}
        required
        maxLength={4000}
        autoFocus={props.autoFocus}
      />
      {error && (
        <p role="alert" className="field-error">
          {error}
        </p>
      )}
      <div className="flex gap-2">
        <button type="submit" className="btn-primary" disabled={busy || !body.trim()}>
          {busy ? "Saving…" : "Add comment"}
        </button>
        {props.onDone && (
          <button type="button" className="btn" onClick={props.onDone}>
            Cancel
          </button>
        )}
      </div>
    </form>
  );
}
