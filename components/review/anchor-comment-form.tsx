"use client";

import { useRouter } from "next/navigation";
import { useEffect, useId, useRef, useState } from "react";
import { ClientApiError, fetchJson } from "@/lib/client/fetch-json";
import { useCommentAnchor } from "./comment-anchor-context";

export type AnchorChoice = { kind: "quantity" | "register"; key: string; label: string; text: string };

/**
 * A new thread on the revision as a whole or on one quantity or register of it.
 * Inside a CommentAnchorProvider the rows' "Comment" buttons choose the anchor.
 */
export function AnchorCommentForm(props: { revisionId: number; anchors: AnchorChoice[] }) {
  const router = useRouter();
  const selectId = useId();
  const bodyId = useId();
  const shared = useCommentAnchor();
  const [ownKey, setOwnKey] = useState("");
  const key = shared?.key ?? ownKey;
  const setKey = shared?.setKey ?? setOwnKey;
  const form = useRef<HTMLFormElement>(null);
  const text = useRef<HTMLTextAreaElement>(null);
  const asked = shared?.asked ?? 0;
  useEffect(() => {
    if (asked === 0) return;
    form.current?.scrollIntoView({ block: "center" });
    text.current?.focus({ preventScroll: true });
  }, [asked]);
  const [body, setBody] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const anchor = props.anchors.find((a) => a.key === key);

  async function send(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setError(null);
    try {
      await fetchJson(`/api/v1/revisions/${props.revisionId}/comments`, {
        method: "POST",
        body: JSON.stringify(anchor ? { body, anchorKind: anchor.kind, anchorKey: anchor.key } : { body }),
      });
      setBody("");
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
    <form
      ref={form}
      id="anchored-comment"
      onSubmit={send}
      className="panel space-y-2"
      aria-label="New comment on a quantity or register"
    >
      <label htmlFor={selectId} className="field-label">
        About
      </label>
      <select id={selectId} className="input" value={key} onChange={(e) => setKey(e.target.value)}>
        <option value="">The whole revision</option>
        {props.anchors.map((a) => (
          <option key={a.key} value={a.key}>
            {a.label} ({a.text})
          </option>
        ))}
      </select>
      <label htmlFor={bodyId} className="field-label">
        Comment
      </label>
      <textarea
        ref={text}
        id={bodyId}
        className="input min-h-20 font-sans"
        value={body}
        onChange={(e) => setBody(e.target.value)}
        required
        maxLength={4000}
      />
      {error && (
        <p role="alert" className="field-error">
          {error}
        </p>
      )}
      <button type="submit" className="btn-primary" disabled={busy || !body.trim()}>
        {busy ? "Saving…" : "Save comment"}
      </button>
    </form>
  );
}
