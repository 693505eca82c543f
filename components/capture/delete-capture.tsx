"use client";
// Deletes the capture (its uploader or an admin). The server refuses with the
// citing checks' numbers while a field check uses it as evidence; that
// message is shown as it came.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { fetchJson } from "@/lib/client/fetch-json";

export function DeleteCapture({ captureId, fileName }: { captureId: number; fileName: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function remove() {
    if (!window.confirm(`Delete capture #${captureId} (${fileName})? This cannot be undone.`)) return;
    setBusy(true);
    setError(null);
    try {
      await fetchJson(`/api/v1/captures/${captureId}`, { method: "DELETE" });
      router.push("/captures");
      router.refresh();
    } catch (err) {
      setError((err as Error).message);
      setBusy(false);
    }
  }

  return (
    <div className="flex flex-col gap-2">
      <h2 className="text-lg font-semibold">Delete this capture</h2>
      <p className="text-sm text-ink-soft">
        Frees its space in your capture quota. A capture a field check cites is kept.
      </p>
      <div>
        <button className="btn" type="button" onClick={remove} disabled={busy}>
          {busy ? "Deleting…" : "Delete capture"}
        </button>
      </div>
      {error && (
        <p role="alert" className="field-error">
          {error}
        </p>
      )}
    </div>
  );
}
