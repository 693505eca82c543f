"use client";
// Live build progress on the revision page: polls the small build route every
// second while the revision builds, and reloads the page's server data once it
// is ready or failed (files, images and bundle appear then). Stops polling then.
import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { fetchJson } from "@/lib/client/fetch-json";
import { BUILD_STATE_WORDS, BUILD_STEP_WORDS, type BuildStatus } from "@/lib/revisions/build-state";

const POLL_MS = 1000;

export function BuildProgress({ initial }: { initial: BuildStatus }) {
  const router = useRouter();
  const [status, setStatus] = useState(initial);
  const [trouble, setTrouble] = useState<string | null>(null);

  useEffect(() => {
    if (status.buildState !== "building") return;
    let stopped = false;
    const timer = setTimeout(async () => {
      try {
        const next = await fetchJson<BuildStatus>(`/api/v1/revisions/${status.id}/build`);
        if (stopped) return;
        setTrouble(null);
        setStatus(next);
        if (next.buildState !== "building") router.refresh();
      } catch (e) {
        // Keep polling: a restarting server or database is not a failed build.
        if (!stopped) {
          setTrouble(e instanceof Error ? e.message : String(e));
          setStatus((s) => ({ ...s }));
        }
      }
    }, POLL_MS);
    return () => {
      stopped = true;
      clearTimeout(timer);
    };
  }, [status, router]);

  return (
    <section aria-labelledby="build-title" className="panel space-y-2" data-testid="build-progress">
      <h2 id="build-title" className="font-semibold">
        Build: <span data-testid="build-state">{BUILD_STATE_WORDS[status.buildState]}</span>
      </h2>
      {status.buildState === "failed" && (
        <p className="text-sm" role="alert" data-testid="build-error">
          {status.buildError ?? "No reason was recorded."} Nothing of this revision was stored but this
          reason; fix it and generate a new revision.
        </p>
      )}
      {status.buildState === "building" && (
        <p className="text-sm text-ink-soft" aria-live="polite">
          A worker builds each target in turn; this page updates by itself.
          {trouble && <> (Could not read the progress just now: {trouble}; trying again.)</>}
        </p>
      )}
      <table className="w-full text-sm">
        <thead>
          <tr className="text-left">
            <th scope="col">Target</th>
            <th scope="col">Device</th>
            <th scope="col">Step</th>
            <th scope="col">Reason</th>
          </tr>
        </thead>
        <tbody>
          {status.targets.map((t) => (
            <tr key={t.folder} data-testid="build-target">
              <td className="num">{t.folder}/</td>
              <td className="num">{t.device}</td>
              <td>{BUILD_STEP_WORDS[t.step]}</td>
              <td className="break-all">{t.reason ?? ""}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}
