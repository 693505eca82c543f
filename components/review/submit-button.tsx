"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ClientApiError, fetchJson } from "@/lib/client/fetch-json";

/** Sends a prepared revision to the checkers. */
export function SubmitForReview({ revisionId, number }: { revisionId: number; number: number }) {
  const router = useRouter();
  const [note, setNote] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setError(null);
    try {
      await fetchJson(`/api/v1/revisions/${revisionId}/submit`, {
        method: "POST",
        body: JSON.stringify({ note }),
      });
      router.refresh();
    } catch (err) {
      setError(err instanceof ClientApiError ? err.message : "Not sent. Check the connection and try again.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={submit} className="space-y-2" aria-label={`Send r${number} for checking`}>
      <label htmlFor="submit-note" className="field-label">
        Note to the checkers (optional)
      </label>
      <textarea
        id="submit-note"
        className="input min-h-16"
        value={note}
        maxLength={2000}
        onChange={(e) => setNote(e.target.value)}
      />
      {error && (
        <p role="alert" className="field-error">
          {error}
        </p>
      )}
      <button type="submit" className="btn-primary" disabled={busy}>
        {busy ? "Sending…" : `Send r${number} for checking`}
      </button>
    </form>
  );
}
