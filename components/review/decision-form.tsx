"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ClientApiError, fetchJson } from "@/lib/client/fetch-json";
import type { DecisionWord } from "@/lib/review/words";

/** Release for the field or return for rework, with a note. A 409 (someone decided first) is shown as is. */
export function DecisionForm({ revisionId, number }: { revisionId: number; number: number }) {
  const router = useRouter();
  const [note, setNote] = useState("");
  const [busy, setBusy] = useState<null | DecisionWord>(null);
  const [error, setError] = useState<string | null>(null);

  async function decide(decision: DecisionWord) {
    if (decision === "return" && !note.trim()) {
      setError("Note: say what has to change, so the engineer knows what to rework.");
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
          Note (to the engineer; with a release it also reaches the technicians)
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
          onClick={() => decide("release")}
        >
          {busy === "release" ? "Releasing…" : `Release r${number} for the field`}
        </button>
        <button type="button" className="btn" disabled={busy !== null} onClick={() => decide("return")}>
          {busy === "return" ? "Saving…" : `Return r${number} for rework`}
        </button>
      </div>
    </form>
  );
}
