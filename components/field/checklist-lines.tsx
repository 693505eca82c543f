"use client";
// Every line of the target's CHECKLIST.md on the phone, grouped by its
// section: a box to tick, a measured value where the line has a Measured
// column (echoed as read and shown against its limits), a note and a photo.
// Safety steps must be ticked before the check can be recorded.
import { formatEng, parseEng, type EngUnit } from "@/lib/engine";
import type { ChecklistStep } from "@/lib/field/checklist-steps";
import { shrinkPhoto, type PickedPhoto } from "./photo";

export type LineEntry = { done: boolean; measured: string; note: string; photo?: PickedPhoto };
export type LineEntries = Record<string, LineEntry>;

export const EMPTY_LINE: LineEntry = { done: false, measured: "", note: "" };

/** The measured text read against the line's limits, or the reason it cannot be read. */
export function readMeasured(step: ChecklistStep, text: string): { value?: number; error?: string } {
  if (!step.range || !text.trim()) return {};
  try {
    return { value: parseEng(text, step.range.unit) };
  } catch (e) {
    return { error: (e as Error).message };
  }
}

function fmt(v: number, unit: EngUnit) {
  return unit === "%" ? `${Number((v * 100).toPrecision(4))} %` : formatEng(v, unit, 6);
}

function sections(steps: ChecklistStep[]): [string, ChecklistStep[]][] {
  const out: [string, ChecklistStep[]][] = [];
  for (const s of steps) {
    const last = out[out.length - 1];
    if (last && last[0] === s.section) last[1].push(s);
    else out.push([s.section, [s]]);
  }
  return out;
}

type Props = {
  steps: ChecklistStep[];
  entries: LineEntries;
  errors: Record<string, string>;
  onChange: (id: string, entry: LineEntry) => void;
  onPhotoError: (id: string, message: string) => void;
};

export function ChecklistLines({ steps, entries, errors, onChange, onPhotoError }: Props) {
  return (
    <div className="flex flex-col gap-4" data-testid="checklist-lines">
      {sections(steps).map(([section, list]) => (
        <fieldset key={section} className="min-w-0">
          <legend className="font-semibold">{section}</legend>
          <ol className="mt-2 flex flex-col gap-2">
            {list.map((s) => {
              const d = entries[s.id] ?? EMPTY_LINE;
              const set = (patch: Partial<LineEntry>) => onChange(s.id, { ...d, ...patch });
              const read = readMeasured(s, d.measured);
              const err = errors[`steps.${s.id}.done`] ?? errors[`steps.${s.id}.measured`] ?? read.error;
              const photoErr = errors[`steps.${s.id}.photo`];
              return (
                <li
                  key={s.id}
                  className={`min-w-0 rounded border p-2 ${s.safety ? "border-hazard" : "border-paper-line"}`}
                  data-testid={`line-${s.id}`}
                >
                  <p className="break-words text-sm">
                    <span className="num font-semibold">{s.id}</span> {s.text}
                  </p>
                  {s.kind === "measure" && (s.expected || s.limits) && (
                    <p className="break-words text-xs text-ink-soft">
                      expected {s.expected}
                      {s.limits && s.limits !== "—" ? ` · limits ${s.limits}` : ""}
                    </p>
                  )}
                  {s.kind === "info" && (
                    <p className="text-xs text-ink-soft">
                      Information: follows from the period and high time.
                    </p>
                  )}
                  {s.from && (
                    <p className="text-xs text-ink-soft">
                      Judged from the measured {s.from === "period" ? "period" : "high time"} above.
                    </p>
                  )}
                  {s.kind === "measure" && !s.from && (
                    <div className="mt-1">
                      <label className="sr-only" htmlFor={`line-${s.id}-measured`}>
                        Measured {s.id}
                      </label>
                      <input
                        id={`line-${s.id}-measured`}
                        className="input num"
                        placeholder={
                          s.range ? `e.g. ${fmt(s.range.min, s.range.unit)}` : "value or observation"
                        }
                        value={d.measured}
                        onChange={(e) => set({ measured: e.target.value })}
                        aria-invalid={!!err}
                      />
                      {read.value !== undefined && s.range && (
                        <p
                          className={`mt-1 text-xs ${read.value >= s.range.min && read.value <= s.range.max ? "text-ok" : "text-hazard"}`}
                          data-testid={`line-${s.id}-echo`}
                        >
                          read as {fmt(read.value, s.range.unit)}:{" "}
                          {read.value >= s.range.min && read.value <= s.range.max
                            ? "within limits"
                            : "outside the limits"}
                        </p>
                      )}
                    </div>
                  )}
                  {s.kind !== "info" && !s.from && (
                    <label className="mt-1 flex items-center gap-2 text-sm">
                      <input
                        type="checkbox"
                        checked={d.done}
                        onChange={(e) => set({ done: e.target.checked })}
                      />
                      {s.safety ? "Confirmed" : "Done"}
                      <span className="sr-only"> {s.id}</span>
                    </label>
                  )}
                  {err && <p className="field-error">{err}</p>}
                  {s.kind !== "info" && (
                    <details className="mt-1" open={!!d.note || !!d.photo || !!photoErr}>
                      <summary className="cursor-pointer text-xs">
                        Note or photo<span className="sr-only"> for {s.id}</span>
                        {d.photo ? " (photo added)" : ""}
                      </summary>
                      <label className="field-label mt-1" htmlFor={`line-${s.id}-note`}>
                        Note for {s.id}
                      </label>
                      <textarea
                        id={`line-${s.id}-note`}
                        className="input"
                        rows={2}
                        value={d.note}
                        onChange={(e) => set({ note: e.target.value })}
                      />
                      <label className="field-label mt-1" htmlFor={`line-${s.id}-photo`}>
                        Photo for {s.id}
                      </label>
                      <input
                        id={`line-${s.id}-photo`}
                        type="file"
                        accept="image/*"
                        capture="environment"
                        className="block w-full max-w-full text-sm"
                        onChange={async (e) => {
                          const file = e.target.files?.[0];
                          if (!file) return;
                          try {
                            set({ photo: await shrinkPhoto(file) });
                          } catch (x) {
                            onPhotoError(s.id, (x as Error).message);
                          }
                        }}
                      />
                      {d.photo && (
                        // eslint-disable-next-line @next/next/no-img-element -- a local blob: preview
                        <img
                          src={d.photo.url}
                          alt={`Photo for ${s.id}`}
                          className="mt-1 max-h-32 max-w-full rounded"
                        />
                      )}
                      {photoErr && <p className="field-error">{photoErr}</p>}
                    </details>
                  )}
                </li>
              );
            })}
          </ol>
        </fieldset>
      ))}
    </div>
  );
}
