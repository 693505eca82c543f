"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ClientApiError, fetchJson } from "@/lib/client/fetch-json";

/** Approve or request changes, with a note. A 409 (someone decided first) is shown as is. */
export function DecisionForm({ revisionId, number }: { revisionId: number; number: number }) {
  const router = useRouter();
  const [note, setNote] = useState("");
  const [busy, setBusy] = useState<null | "approved" | "changes_requested">(null);
  const [error, setError] = useState<string | null>(null);

  async function decide(decision: "approved" | "changes_requested") {
    if (decision === "changes_requested" && !note.trim()) {
      setError("Say what has to change in the note, so the engineer knows what to do.");
      return;
    }
    setBusy(decision);
    setError(null);
    try {
      await fetchJson(`/api/v1/revisions/${revisionId}/decision`, {
        method: "POST",
        body: JSON.stringify({ decision, note }),
      });
      router.refresh();
    } catch (err) {
      setError(
        err instanceof ClientApiError
          ? err.message
          : "The decision was not saved. Check the connection and try again.",
      );
    } finally {
      setBusy(null);
    }
  }

  return (
    <form className="space-y-3" onSubmit={(e) => e.preventDefault()} aria-label={`Decide on r${number}`}>
      <div>
        <label htmlFor="decision-note" className="field-label">
          Note to the engineer
        </label>
        <textarea
          id="decision-note"
          className="input min-h-20"
          value={note}
          maxLength={4000}
          onChange={(e) => setNote(e.target.value)}
        />
      </div>
      {error && (
        <p role="alert" className="field-error">
          {error}
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        <button
          type="button"
          className="btn-primary"
          disabled={busy !== null}
          onClick={() => decide("approved")}
        >
          {busy === "approved" ? "Approving…" : `Approve r${number}`}
        </button>
        <button
          type="button"
          className="btn"
          disabled={busy !== null}
          onClick={() => decide("changes_requested")}
        >
          {busy === "changes_requested" ? "Saving…" : "Request changes"}
        </button>
      </div>
    </form>
  );
}
