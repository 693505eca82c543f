"use client";
// The retrofit's revisions, newest first, with links to the revision page,
// the bundle and the comparison with the previous one.
import Link from "next/link";
import type { RevisionState } from "@/db/schema";
import { BUILD_STATE_WORDS, type BuildState } from "@/lib/revisions/build-state";
import { StateBadge } from "@/components/review/state-badge";

export type RevisionListItem = {
  id: number;
  number: number;
  state: RevisionState;
  engineVersion: string;
  bundleSha256: string;
  buildState: BuildState;
  note: string;
  createdAt: string;
  supersededAt: string | null;
  createdByName: string | null;
};

export function RevisionsList({
  retrofitId,
  revisions,
}: {
  retrofitId: number;
  revisions: RevisionListItem[];
}) {
  return (
    <section aria-labelledby="revisions-title" className="panel">
      <h2 id="revisions-title" className="mb-2 font-semibold">
        Revisions
      </h2>
      {revisions.length === 0 ? (
        <p className="text-sm text-ink-soft">
          No revision yet. When the stage and targets are right, generate r1: it freezes them with the code
          and the bundle.
        </p>
      ) : (
        <table className="table-dense" data-testid="revisions-table">
          <thead>
            <tr>
              <th>Revision</th>
              <th>State</th>
              <th>Made</th>
              <th>Bundle sha256</th>
              <th>
                <span className="sr-only">Links</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {revisions.map((r, i) => (
              <tr key={r.id}>
                <td>
                  <Link className="num font-medium underline" href={`/revisions/${r.id}`}>
                    r{r.number}
                  </Link>
                  {r.note && <span className="ml-2 text-ink-soft">{r.note}</span>}
                </td>
                <td>
                  <StateBadge state={r.state} superseded={r.supersededAt !== null} />
                </td>
                <td className="num">
                  {r.createdAt.slice(0, 16).replace("T", " ")} {r.createdByName ?? ""}
                </td>
                {r.buildState === "ready" ? (
                  <td className="num" title={r.bundleSha256}>
                    {r.bundleSha256.slice(0, 12)}…
                  </td>
                ) : (
                  <td data-testid="revision-build-state">{BUILD_STATE_WORDS[r.buildState]}</td>
                )}
                <td className="space-x-3 whitespace-nowrap">
                  {r.buildState === "ready" && (
                    <a className="underline" href={`/api/v1/revisions/${r.id}/bundle`} download>
                      Download r{r.number}
                    </a>
                  )}
                  {i < revisions.length - 1 && (
                    <Link className="underline" href={`/retrofits/${retrofitId}/compare?b=${r.id}`}>
                      Compare
                    </Link>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </section>
  );
}
