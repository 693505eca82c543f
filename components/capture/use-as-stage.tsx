"use client";
// Makes the capture's mean period and high time the retrofit's measured stage.
import { useState } from "react";
import { fetchJson } from "@/lib/client/fetch-json";
import { formatEng } from "@/lib/engine";

type Stage = { retrofitId: number; periodS: number; highS: number };

export function UseAsStage({ captureId, retrofitId }: { captureId: number; retrofitId: number | null }) {
  const [target, setTarget] = useState(retrofitId === null ? "" : String(retrofitId));
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<Stage | null>(null);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    if (!/^[1-9][0-9]*$/.test(target)) {
      setError("Enter the retrofit's number (from its page address).");
      return;
    }
    setBusy(true);
    setError(null);
    try {
      const res = await fetchJson<{ stage: Stage }>(`/api/v1/captures/${captureId}/use-as-stage`, {
        method: "POST",
        body: JSON.stringify({ retrofitId: Number(target) }),
      });
      setDone(res.stage);
    } catch (err) {
      setError(`${(err as Error).message}`);
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-2" aria-labelledby="stage-title">
      <h2 id="stage-title" className="text-lg font-semibold">
        Use as the retrofit&apos;s stage
      </h2>
      <p className="text-sm text-ink-soft">
        Replaces the retrofit&apos;s stage with a measured one (mean period and high time of this capture).
        The capture stays linked.
      </p>
      <div className="max-w-xs">
        <label className="field-label" htmlFor="stage-retrofit">
          Retrofit number
        </label>
        <input
          id="stage-retrofit"
          className="input num"
          inputMode="numeric"
          value={target}
          readOnly={retrofitId !== null}
          onChange={(e) => setTarget(e.target.value.trim())}
        />
      </div>
      <div>
        <button className="btn-primary" type="submit" disabled={busy}>
          {busy ? "Saving…" : "Use as measured stage"}
        </button>
      </div>
      {error && (
        <p role="alert" className="field-error">
          {error}
        </p>
      )}
      {done && (
        <p role="status" className="text-sm">
          Retrofit {done.retrofitId} now has a measured stage: period{" "}
          <span className="num">{formatEng(done.periodS, "s", 6)}</span>, high{" "}
          <span className="num">{formatEng(done.highS, "s", 6)}</span>.{" "}
          <a className="underline" href={`/retrofits/${done.retrofitId}`}>
            Open the retrofit
          </a>
        </p>
      )}
    </form>
  );
}
