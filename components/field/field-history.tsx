"use client";
// A retrofit's field history: every check, newest first, with its lines.
// Embedded on the retrofit page and on the field pages.
import useSWR from "swr";
import { formatEng } from "@/lib/engine";
import type { FieldCheckView } from "@/lib/field/shapes";
import { deviceName } from "@/components/retrofit/format";
import { CheckLines } from "./check-lines";
import { StepResults } from "./step-results";
import { historyKey } from "./keys";

export function FieldHistory({ retrofitId }: { retrofitId: number }) {
  const { data, error, isLoading } = useSWR<{ checks: FieldCheckView[] }>(historyKey(retrofitId));
  return (
    <section
      aria-labelledby={`history-${retrofitId}`}
      className="flex flex-col gap-3"
      data-testid="field-history"
    >
      <h2 id={`history-${retrofitId}`} className="text-lg font-semibold">
        Field history
      </h2>
      {isLoading && <p className="text-ink-soft">Loading field checks…</p>}
      {error && (
        <p role="alert" className="field-error">
          Field checks could not be loaded: {(error as Error).message} Reload the page to try again.
        </p>
      )}
      {data && data.checks.length === 0 && (
        <p className="text-ink-soft">
          No field checks yet. A technician records one from the Field page after installing a released
          bundle.
        </p>
      )}
      {data && data.checks.length > 0 && (
        <ol className="flex flex-col gap-3">
          {data.checks.map((c) => (
            <li key={c.id} className="panel" data-testid="field-check" data-passed={c.passed}>
              <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
                <span className={`font-semibold ${c.passed ? "text-ok" : "text-hazard"}`}>
                  {c.passed ? "Passed" : "Failed"}
                </span>
                <span className="num">r{c.revisionNumber}</span>
                <span className="text-sm" data-testid="checked-what">
                  {c.boardRef ? (
                    <>
                      board <strong>{c.boardRef}</strong> ·{" "}
                    </>
                  ) : null}
                  {c.device ? deviceName(c.device) : "—"}
                  {c.target !== null ? ` · target ${c.target + 1}` : ""}
                </span>
                <time className="num text-sm text-ink-soft" dateTime={c.createdAt}>
                  {c.createdAt.slice(0, 16).replace("T", " ")} UTC
                </time>
                <span className="text-sm">
                  period{" "}
                  <span className="num">
                    {c.measuredPeriodS === null ? "—" : formatEng(c.measuredPeriodS, "s", 6)}
                  </span>
                  , high{" "}
                  <span className="num">
                    {c.measuredHighS === null ? "—" : formatEng(c.measuredHighS, "s", 6)}
                  </span>
                </span>
                {c.captureId !== null && (
                  <a className="text-sm underline" href={`/captures/${c.captureId}`}>
                    capture #{c.captureId}
                  </a>
                )}
              </div>
              <a
                className="mt-1 block w-fit text-sm underline"
                href={`/api/v1/field-checks/${c.id}/record`}
                download
              >
                Export record (PDF)<span className="sr-only"> of check {c.id}</span>
              </a>
              <p className="mt-1 text-sm" data-testid="signed-off">
                Signed off by <strong>{c.signedOffBy}</strong>
                {c.technician.name !== c.signedOffBy ? ` (recorded by ${c.technician.name})` : ""}
              </p>
              {c.notes && <p className="mt-1 whitespace-pre-wrap text-sm text-ink-soft">{c.notes}</p>}
              <details className="mt-2">
                <summary className="cursor-pointer text-sm">Checklist lines</summary>
                <CheckLines lines={c.lines} />
                {c.steps.length > 0 && <StepResults steps={c.steps} />}
              </details>
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
