// The checklist lines recorded with a field check: done or not, what was
// measured and its verdict, the note and the photo. Verdicts are spelled out.
import { formatEng, type EngUnit } from "@/lib/engine";
import type { StepResult } from "@/lib/field/shapes";

function verdict(r: StepResult): { text: string; cls: string } {
  if (r.kind === "info") return { text: "Information", cls: "text-ink-soft" };
  if (r.pass === false) return { text: "Fail", cls: "font-semibold text-hazard" };
  if (r.pass === true) return { text: r.value !== null ? "Pass" : "Done", cls: "font-semibold text-ok" };
  return { text: "Not done", cls: "text-ink-soft" };
}

function measuredText(r: StepResult): string {
  if (r.measured) return r.measured;
  if (r.value !== null) return formatEng(r.value, r.unit as EngUnit, 6);
  return "";
}

/** Done lines out of the lines a technician can do (information lines left out). */
export function doneCount(steps: StepResult[]): { done: number; of: number; failed: number } {
  const doable = steps.filter((s) => s.kind !== "info");
  return {
    done: doable.filter((s) => s.pass !== null).length,
    of: doable.length,
    failed: doable.filter((s) => s.pass === false).length,
  };
}

export function StepResults({ steps }: { steps: StepResult[] }) {
  const c = doneCount(steps);
  return (
    <div className="mt-2" data-testid="step-results">
      <p className="text-sm" data-testid="step-count">
        {c.done} of {c.of} checklist lines done{c.failed ? `, ${c.failed} failed` : ""}.
      </p>
      <ol className="mt-1 flex flex-col gap-1">
        {steps
          .filter((r) => r.kind !== "info")
          .map((r) => {
            const v = verdict(r);
            const m = measuredText(r);
            return (
              <li key={r.id} className="min-w-0 break-words text-sm" data-testid={`step-${r.id}`}>
                <span className="num font-semibold">{r.id}</span> <span className={v.cls}>{v.text}</span>
                {m && (
                  <>
                    {" "}
                    · <span className="num">{m}</span>
                  </>
                )}{" "}
                · <span className="text-ink-soft">{r.text}</span>
                {r.note && <span className="block whitespace-pre-wrap text-ink-soft">Note: {r.note}</span>}
                {r.photoId !== undefined && (
                  <a href={`/api/v1/field-checks/photos/${r.photoId}`} className="block w-fit">
                    {/* eslint-disable-next-line @next/next/no-img-element -- a stored photo served by our API */}
                    <img
                      src={`/api/v1/field-checks/photos/${r.photoId}`}
                      alt={`Photo for ${r.id}`}
                      className="mt-1 max-h-24 max-w-full rounded"
                      loading="lazy"
                    />
                  </a>
                )}
              </li>
            );
          })}
      </ol>
    </div>
  );
}
