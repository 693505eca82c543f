"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ClientApiError, fetchJson } from "@/lib/client/fetch-json";
import type { Proof } from "@/lib/revisions/emulations";

/**
 * Sends a prepared revision to the checkers. A revision not proven in the
 * emulator needs the author's reason (the API refuses without it); one whose
 * emulated output differs cannot be sent (the API refuses it too).
 */
export function SubmitForReview({
  revisionId,
  number,
  proof,
}: {
  revisionId: number;
  number: number;
  proof: Proof;
}) {
  const router = useRouter();
  const [note, setNote] = useState("");
  const [unprovenReason, setUnprovenReason] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setError(null);
    try {
      await fetchJson(`/api/v1/revisions/${revisionId}/submit`, {
        method: "POST",
        body: JSON.stringify(proof.state === "not-proven" ? { note, unprovenReason } : { note }),
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
      {proof.state === "differs" && (
        <p className="field-error">
          The emulated output of {proof.folders.join(", ")} differs from the plan: this revision cannot be
          sent for checking. Fix the cause and generate a new revision.
        </p>
      )}
      {proof.state === "not-proven" && (
        <>
          <p className="text-sm">Not proven in an emulator: {proof.reasons.join(" ")}</p>
          <label htmlFor="unproven-reason" className="field-label">
            Why it may be checked anyway (required, shown to the checker)
          </label>
          <textarea
            id="unproven-reason"
            className="input min-h-16"
            value={unprovenReason}
            maxLength={2000}
            required
            onChange={(e) => setUnprovenReason(e.target.value)}
          />
        </>
      )}
      {error && (
        <p role="alert" className="field-error">
          {error}
        </p>
      )}
      <button type="submit" className="btn-primary" disabled={busy || proof.state === "differs"}>
        {busy ? "Sending…" : `Send r${number} for checking`}
      </button>
    </form>
  );
}
