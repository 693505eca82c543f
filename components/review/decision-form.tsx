"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ClientApiError, fetchJson } from "@/lib/client/fetch-json";
import type { DecisionWord } from "@/lib/review/words";

/** Release for the field or return for rework, with a note. A 409 (someone decided first) is shown as is. */
export function DecisionForm({
  revisionId,
  number,
  missed = "",
}: {
  revisionId: number;
  number: number;
  /** what misses its budget (lib/review/budget-miss.ts); a release then needs a reason */
  missed?: string;
}) {
  const router = useRouter();
  const [note, setNote] = useState("");
  const [override, setOverride] = useState("");
  const [busy, setBusy] = useState<null | DecisionWord>(null);
  const [error, setError] = useState<string | null>(null);

  async function decide(decision: DecisionWord) {
    if (decision === "return" && !note.trim()) {
      setError("Note: say what has to change, so the engineer knows what to rework.");
      return;
    }
    if (decision === "release" && missed && !override.trim()) {
      setError("Reason for releasing despite the miss: say why the board may go to the field as it is.");
      return;
    }
    setBusy(decision);
    setError(null);
    try {
      await fetchJson(`/api/v1/revisions/${revisionId}/decision`, {
        method: "POST",
        body: JSON.stringify(
          decision === "release" && missed ? { decision, note, override } : { decision, note },
        ),
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
      {missed && (
        <div className="rounded border-2 border-hazard p-2" data-testid="budget-miss">
          <p className="text-sm font-semibold text-hazard">Budget missed: {missed}.</p>
          <label htmlFor="decision-override" className="field-label">
            Reason for releasing despite the miss (recorded, and sent to the engineer and the technicians)
          </label>
          <textarea
            id="decision-override"
            className="input min-h-16"
            value={override}
            maxLength={2000}
            onChange={(e) => setOverride(e.target.value)}
          />
        </div>
      )}
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
          {busy === "release"
            ? "Releasing…"
            : missed
              ? `Release r${number} despite the miss`
              : `Release r${number} for the field`}
        </button>
        <button type="button" className="btn" disabled={busy !== null} onClick={() => decide("return")}>
          {busy === "return" ? "Saving…" : `Return r${number} for rework`}
        </button>
      </div>
    </form>
  );
}
