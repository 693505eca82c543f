"use client";
// Marks one stage value adjustable (a pot, a trimmer or a selector switch)
// and shows the stage's timing over the control's travel. Values are typed in
// engineering notation; a bad value gets a message naming its field, and the
// typed text stays in its box.
import { useState } from "react";
import { useFormContext } from "react-hook-form";
import { TravelChart } from "@/components/charts/travel-chart";
import { analyzeTravel, isEngineError, STAGE_FIELDS, type Stage, type TravelAnalysis } from "@/lib/engine";
import { NO_CONTROL, readControl, type ControlFormValues } from "@/lib/validation/control";
import { fmtS } from "./format";

type Kind = ControlFormValues["kind"];
export type Draft = ControlFormValues;

export function travelFor(
  stage: Stage | null,
  d: Draft,
  field: string,
): { travel: TravelAnalysis } | { error: string } | null {
  if (!stage || d.kind === "none") return null;
  const read = readControl(stage, { ...d, field });
  if (!read.ok) return { error: read.message };
  if (!read.control) return null;
  try {
    return { travel: analyzeTravel(stage, read.control) };
  } catch (e) {
    if (isEngineError(e)) return { error: e.message };
    throw e;
  }
}

const inputClass = "mt-1 w-full rounded border border-paper-line px-2 py-1";

function fieldChoices(stage: Stage | null, kind: Kind) {
  const fields = stage ? (STAGE_FIELDS[stage.kind] ?? []).filter((f) => f.unit !== "bool") : [];
  return kind === "selector" ? fields : fields.filter((f) => f.unit === "Ω");
}

// Inside the workspace form the draft is the form's "control" value, so it is
// saved with the stage and validated by the same schema; alone it keeps its own state.
export function ControlFields({ stage }: { stage: Stage | null }) {
  const form = useFormContext<{ control: Draft }>();
  const [d, setD] = useState<Draft>(() => form?.getValues("control") ?? { ...NO_CONTROL });
  const choices = fieldChoices(stage, d.kind);
  const field = choices.some((f) => f.name === d.field) ? d.field : (choices[0]?.name ?? "");

  // the React compiler memoises this render-pure call
  const result = travelFor(stage, d, field);
  const travel = result && "travel" in result ? result.travel : null;

  const set = (patch: Partial<Draft>) => {
    const next = { ...d, ...patch };
    const nextChoices = fieldChoices(stage, next.kind);
    if (!nextChoices.some((f) => f.name === next.field)) next.field = nextChoices[0]?.name ?? "";
    setD(next);
    form?.setValue("control", next, { shouldDirty: true, shouldValidate: true });
  };
  return (
    <fieldset className="space-y-2 text-sm" aria-labelledby="control-title">
      <legend id="control-title" className="font-medium">
        Adjustable value on the old board
      </legend>
      <div className="grid gap-2 sm:grid-cols-3">
        <label>
          Control
          <select
            className={inputClass}
            value={d.kind}
            onChange={(e) => set({ kind: e.target.value as Kind })}
          >
            <option value="none">none (fixed value)</option>
            <option value="pot">potentiometer</option>
            <option value="trimmer">trimmer (set once)</option>
            <option value="selector">selector switch</option>
          </select>
        </label>
        {d.kind !== "none" && (
          <label>
            Value it sets
            <select className={inputClass} value={field} onChange={(e) => set({ field: e.target.value })}>
              {choices.map((f) => (
                <option key={f.name} value={f.name}>
                  {f.label}
                </option>
              ))}
            </select>
          </label>
        )}
        {(d.kind === "pot" || d.kind === "trimmer") && (
          <>
            <label>
              Track resistance
              <input
                className={inputClass}
                value={d.trackR}
                placeholder="47k"
                onChange={(e) => set({ trackR: e.target.value })}
              />
            </label>
            <label>
              Fixed resistor in series
              <input
                className={inputClass}
                value={d.seriesR}
                placeholder="0"
                onChange={(e) => set({ seriesR: e.target.value })}
              />
            </label>
          </>
        )}
        {d.kind === "pot" && (
          <label>
            Taper
            <select
              className={inputClass}
              value={d.taper}
              onChange={(e) => set({ taper: e.target.value as Draft["taper"] })}
            >
              <option value="linear">linear</option>
              <option value="log">logarithmic</option>
            </select>
          </label>
        )}
        {d.kind === "selector" && (
          <label className="sm:col-span-2">
            Values per switch position
            <input
              className={inputClass}
              value={d.values}
              placeholder="100n, 220n, 470n"
              onChange={(e) => set({ values: e.target.value })}
            />
          </label>
        )}
      </div>
      {result && "error" in result && (
        <p role="alert" className="rounded border-l-4 border-hazard bg-hazard-soft px-2 py-1">
          {result.error}
        </p>
      )}
      {travel && (
        <div className="space-y-1">
          <TravelChart travel={travel} />
          {travel.runningRange && (
            <p className="num">
              {travel.quantity === "firingDelayS" ? "Firing delay" : "Period"} over the travel:{" "}
              {fmtS(travel.runningRange.minS)} … {fmtS(travel.runningRange.maxS)}
            </p>
          )}
          {travel.checks.map((c) => (
            <p
              key={c.code}
              role="alert"
              className="rounded border-l-4 border-hazard bg-hazard-soft px-2 py-1"
            >
              <span className="font-semibold">Error:</span> {c.message}
            </p>
          ))}
        </div>
      )}
    </fieldset>
  );
}
