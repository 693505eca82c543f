"use client";
// Makes the capture's mean period and high time a retrofit's measured stage,
// the retrofit picked from those the user may edit (a capture tied to a
// retrofit offers that one only).
import { useState } from "react";
import { fetchJson } from "@/lib/client/fetch-json";
import { formatEng } from "@/lib/engine";
import type { StageRetrofit } from "@/lib/field/stage-retrofits";

type Stage = { retrofitId: number; periodS: number; highS: number };

type Props = { captureId: number; retrofitId: number | null; choices: StageRetrofit[] };

export function UseAsStage({ captureId, retrofitId, choices }: Props) {
  const [target, setTarget] = useState(retrofitId === null ? "" : String(retrofitId));
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<Stage | null>(null);
  const label = (r: StageRetrofit) => `${r.assetTag} · ${r.name}`;
  // Grouped by site, so each option stays short enough for a phone.
  const sites = [...new Set(choices.map((r) => r.site))];

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    if (target === "") {
      setError("Choose the retrofit whose stage this capture measures.");
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

  const picked = choices.find((r) => String(r.id) === String(done?.retrofitId));
  return (
    <form onSubmit={submit} className="flex flex-col gap-2" aria-labelledby="stage-title">
      <h2 id="stage-title" className="text-lg font-semibold">
        Use as a retrofit&apos;s stage
      </h2>
      <p className="text-sm text-ink-soft">
        Replaces the retrofit&apos;s stage with a measured one (mean period and high time of this capture).
        The capture stays linked.
        {retrofitId !== null && " This capture was uploaded for one retrofit and goes to that one only."}
      </p>
      <div className="min-w-0 max-w-full">
        <label className="field-label" htmlFor="stage-retrofit">
          Retrofit
        </label>
        <select
          id="stage-retrofit"
          className="input max-w-full"
          value={target}
          onChange={(e) => setTarget(e.target.value)}
        >
          {retrofitId === null && <option value="">Choose a retrofit…</option>}
          {sites.map((site) => (
            <optgroup key={site} label={site}>
              {choices
                .filter((r) => r.site === site)
                .map((r) => (
                  <option key={r.id} value={String(r.id)}>
                    {label(r)}
                  </option>
                ))}
            </optgroup>
          ))}
        </select>
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
          {picked ? `${picked.assetTag} · ${picked.name}` : `Retrofit ${done.retrofitId}`} now has a measured
          stage: period <span className="num">{formatEng(done.periodS, "s", 6)}</span>, high{" "}
          <span className="num">{formatEng(done.highS, "s", 6)}</span>.{" "}
          <a className="underline" href={`/retrofits/${done.retrofitId}`}>
            Open the retrofit
          </a>
        </p>
      )}
    </form>
  );
}
