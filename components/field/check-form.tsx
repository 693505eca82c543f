"use client";
// Field check against one approved revision. The technician types the measured
// period and high time (engineering notation: 10m, 2.0 ms) or picks an uploaded
// capture; the server computes the checklist limits and the verdict.
import { useState } from "react";
import useSWR, { useSWRConfig } from "swr";
import { ClientApiError, fetchJson } from "@/lib/client/fetch-json";
import { formatEng, parseEng } from "@/lib/engine";
import type { CaptureView, FieldCheckView } from "@/lib/field/shapes";
import type { ChecklistStep } from "@/lib/field/checklist-steps";
import { CheckLines } from "./check-lines";
import { ChecklistLines, EMPTY_LINE, readMeasured, type LineEntries } from "./checklist-lines";
import { StepResults } from "./step-results";
import { capturesKey, historyKey } from "./keys";
import { defaultResolutionS } from "./reading-step";
import { deviceName } from "@/components/retrofit/format";

type Props = {
  revisionId: number;
  retrofitId: number;
  devices: string[];
  signer: string;
  /** Each target's CHECKLIST.md lines, in target order. */
  checklists?: ChecklistStep[][];
};
type Errors = Partial<
  Record<"measuredPeriodS" | "measuredHighS" | "resolutionS" | "signedOffBy" | "form", string>
> &
  Record<string, string | undefined>;

function readTime(text: string, allowZero = false): number | string | undefined {
  if (!text.trim()) return undefined;
  try {
    const v = parseEng(text, "s");
    return v > 0 || (allowZero && v === 0) ? v : "Enter a time greater than zero.";
  } catch (e) {
    return (e as Error).message;
  }
}

/** What a field read, shown under it so a slip ("6m16" for 6.16 ms) is visible. */
function Echo({ id, value }: { id: string; value: number | string | undefined }) {
  if (typeof value !== "number") return null;
  return (
    <p id={id} className="mt-1 text-xs text-ink-muted" data-testid={id}>
      read as {formatEng(value, "s", 6)}
    </p>
  );
}

function defaultFor(period: number | string | undefined): number | undefined {
  return typeof period === "number" ? defaultResolutionS(period) : undefined;
}

export function CheckForm({ revisionId, retrofitId, devices, signer, checklists = [] }: Props) {
  const { mutate } = useSWRConfig();
  const { data: captureList } = useSWR<{ captures: CaptureView[] }>(capturesKey(retrofitId));
  const [target, setTarget] = useState(0);
  const [period, setPeriod] = useState("");
  const [high, setHigh] = useState("");
  const [resolution, setResolution] = useState("");
  const [captureId, setCaptureId] = useState("");
  const [notes, setNotes] = useState("");
  const [signedOffBy, setSignedOffBy] = useState(signer);
  const [errors, setErrors] = useState<Errors>({});
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<FieldCheckView | null>(null);
  const [entries, setEntries] = useState<LineEntries>({});
  const steps = checklists[target] ?? [];

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const p = readTime(period);
    const h = readTime(high);
    const r = resolution.trim() ? readTime(resolution, true) : defaultFor(p);
    const next: Errors = {};
    if (typeof r === "string") next.resolutionS = r;
    if (typeof p === "string") next.measuredPeriodS = p;
    if (typeof h === "string") next.measuredHighS = h;
    if (!captureId && p === undefined) next.measuredPeriodS = "Enter the measured period, or pick a capture.";
    if (!captureId && h === undefined)
      next.measuredHighS = "Enter the measured high time, or pick a capture.";
    if (!signedOffBy.trim()) next.signedOffBy = "Sign with your name.";
    for (const s of steps) {
      const d = entries[s.id] ?? EMPTY_LINE;
      if (s.safety && !d.done) next[`steps.${s.id}.done`] = "Confirm this safety step.";
      const read = readMeasured(s, d.measured);
      if (read.error) next[`steps.${s.id}.measured`] = read.error;
    }
    if (Object.keys(next).some((k) => k.startsWith("steps.")))
      next.form = "A checklist line needs attention; see the marked lines.";
    setErrors(next);
    if (Object.keys(next).length) return;
    setBusy(true);
    setResult(null);
    try {
      const body = {
        revisionId,
        target,
        ...(typeof p === "number" ? { measuredPeriodS: p } : {}),
        ...(typeof h === "number" ? { measuredHighS: h } : {}),
        ...(typeof r === "number" ? { resolutionS: r } : {}),
        ...(captureId ? { captureId: Number(captureId) } : {}),
        notes,
        signedOffBy: signedOffBy.trim(),
        ...(steps.length
          ? {
              steps: steps
                .filter((s) => s.kind !== "info" && !s.from)
                .map((s) => {
                  const d = entries[s.id] ?? EMPTY_LINE;
                  return {
                    id: s.id,
                    done: d.done,
                    measured: d.measured,
                    note: d.note,
                    ...(d.photo ? { photo: { mediaType: d.photo.mediaType, base64: d.photo.base64 } } : {}),
                  };
                }),
            }
          : {}),
      };
      const res = await fetchJson<{ check: FieldCheckView }>("/api/v1/field-checks", {
        method: "POST",
        body: JSON.stringify(body),
      });
      setResult(res.check);
      setPeriod("");
      setHigh("");
      setResolution("");
      setCaptureId("");
      setNotes("");
      setEntries({});
      await mutate(historyKey(retrofitId));
    } catch (err) {
      const f = err instanceof ClientApiError ? (err.fields ?? {}) : {};
      setErrors({ ...f, form: `${(err as Error).message} Correct the marked fields and record again.` });
    } finally {
      setBusy(false);
    }
  }

  const captures = captureList?.captures ?? [];
  const parsedPeriod = readTime(period);
  const parsedHigh = readTime(high);
  const parsedResolution = resolution.trim() ? readTime(resolution, true) : undefined;
  const fallback = defaultFor(parsedPeriod);
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3" aria-labelledby="check-title">
      <h2 id="check-title" className="text-lg font-semibold">
        Record a field check
      </h2>
      {devices.length > 1 && (
        <div>
          <label className="field-label" htmlFor="check-target">
            Board (target)
          </label>
          <select
            id="check-target"
            className="input"
            value={target}
            onChange={(e) => {
              setTarget(Number(e.target.value));
              setEntries({});
            }}
          >
            {devices.map((d, i) => (
              <option key={i} value={i}>
                {i + 1}: {deviceName(d)}
              </option>
            ))}
          </select>
        </div>
      )}
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <label className="field-label" htmlFor="check-period">
            Measured period
          </label>
          <input
            id="check-period"
            className="input num"
            inputMode="decimal"
            placeholder="e.g. 10.0 ms"
            value={period}
            onChange={(e) => setPeriod(e.target.value)}
            aria-invalid={!!errors.measuredPeriodS}
            aria-describedby={errors.measuredPeriodS ? "check-period-error" : undefined}
          />
          <Echo id="check-period-echo" value={parsedPeriod} />
          {errors.measuredPeriodS && (
            <p id="check-period-error" className="field-error">
              {errors.measuredPeriodS}
            </p>
          )}
        </div>
        <div>
          <label className="field-label" htmlFor="check-high">
            Measured high time
          </label>
          <input
            id="check-high"
            className="input num"
            inputMode="decimal"
            placeholder="e.g. 2.00 ms"
            value={high}
            onChange={(e) => setHigh(e.target.value)}
            aria-invalid={!!errors.measuredHighS}
            aria-describedby={errors.measuredHighS ? "check-high-error" : undefined}
          />
          <Echo id="check-high-echo" value={parsedHigh} />
          {errors.measuredHighS && (
            <p id="check-high-error" className="field-error">
              {errors.measuredHighS}
            </p>
          )}
        </div>
      </div>
      <div>
        <label className="field-label" htmlFor="check-resolution">
          Instrument resolution
        </label>
        <input
          id="check-resolution"
          className="input num"
          inputMode="decimal"
          placeholder={typeof fallback === "number" ? `default ${formatEng(fallback, "s", 3)}` : "e.g. 10 us"}
          value={resolution}
          onChange={(e) => setResolution(e.target.value)}
          aria-invalid={!!errors.resolutionS}
          aria-describedby="check-resolution-help"
        />
        <p
          id="check-resolution-help"
          className="mt-1 text-xs text-ink-muted"
          data-testid="check-resolution-echo"
        >
          {typeof parsedResolution === "number"
            ? `read as ${formatEng(parsedResolution, "s", 3)}; added to each limit.`
            : typeof fallback === "number"
              ? `Blank: ${formatEng(fallback, "s", 3)}, one step in the third digit of the period; added to each limit.`
              : "The smallest step you can read (scope cursor step, counter's last digit); added to each limit."}
        </p>
        {errors.resolutionS && <p className="field-error">{errors.resolutionS}</p>}
      </div>
      <div>
        <label className="field-label" htmlFor="check-capture">
          Or take the values from a capture
        </label>
        <select
          id="check-capture"
          className="input"
          value={captureId}
          onChange={(e) => setCaptureId(e.target.value)}
        >
          <option value="">No capture (typed values)</option>
          {captures.map((c) => (
            <option key={c.id} value={c.id}>
              #{c.id} {c.fileName}: {formatEng(c.measurement.periodS.mean, "s", 5)} /{" "}
              {formatEng(c.measurement.highS.mean, "s", 5)}
            </option>
          ))}
        </select>
        <p className="mt-1 text-xs text-ink-muted">Typed values win over the capture&apos;s.</p>
      </div>
      {steps.length > 0 && (
        <section aria-labelledby="lines-title" className="flex flex-col gap-2">
          <h3 id="lines-title" className="font-semibold">
            Checklist lines ({deviceName(devices[target] ?? "")}, target {target + 1})
          </h3>
          <p className="text-xs text-ink-muted">
            Tick each line as you do it, type what you measured, add a note or a photo. Safety steps are
            confirmed before the check is recorded.
          </p>
          <ChecklistLines
            steps={steps}
            entries={entries}
            errors={Object.fromEntries(
              Object.entries(errors).filter((e): e is [string, string] => typeof e[1] === "string"),
            )}
            onChange={(id, d) => setEntries((all) => ({ ...all, [id]: d }))}
            onPhotoError={(id, message) => setErrors((all) => ({ ...all, [`steps.${id}.photo`]: message }))}
          />
        </section>
      )}
      <div>
        <label className="field-label" htmlFor="check-notes">
          Notes
        </label>
        <textarea
          id="check-notes"
          className="input"
          rows={3}
          value={notes}
          onChange={(e) => setNotes(e.target.value)}
        />
      </div>
      <div>
        <label className="field-label" htmlFor="check-signer">
          Signed off by
        </label>
        <input
          id="check-signer"
          className="input"
          autoComplete="name"
          value={signedOffBy}
          onChange={(e) => setSignedOffBy(e.target.value)}
          aria-invalid={!!errors.signedOffBy}
        />
        {errors.signedOffBy && <p className="field-error">{errors.signedOffBy}</p>}
      </div>
      {errors.form && (
        <p role="alert" className="field-error">
          {errors.form}
        </p>
      )}
      <div>
        <button type="submit" className="btn-primary" disabled={busy}>
          {busy ? "Recording…" : "Record check"}
        </button>
      </div>
      {result && (
        <div
          role="status"
          className={`rounded border-2 p-3 ${result.passed ? "border-ok bg-ok-soft" : "border-hazard bg-hazard-soft"}`}
          data-testid="check-result"
        >
          <p className="font-semibold">
            {result.passed
              ? "Check passed: every line is within its limits."
              : "Check failed: a line is outside its limits. The revision's author has been e-mailed."}
          </p>
          <CheckLines lines={result.lines} />
          {result.steps.length > 0 && <StepResults steps={result.steps} />}
        </div>
      )}
    </form>
  );
}
