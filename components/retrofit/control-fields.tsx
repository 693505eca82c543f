"use client";
// Marks one stage value adjustable (a pot, a trimmer or a selector switch)
// and shows the stage's timing over the control's travel. Values are typed in
// engineering notation; a bad value gets a message naming its field, and the
// typed text stays in its box.
import { useState } from "react";
import { TravelChart } from "@/components/charts/travel-chart";
import {
  analyzeTravel,
  isEngineError,
  parseEng,
  STAGE_FIELDS,
  type Stage,
  type StageControl,
  type TravelAnalysis,
} from "@/lib/engine";
import { fmtS } from "./format";

type Kind = "none" | StageControl["kind"];

export interface Draft {
  kind: Kind;
  field: string;
  seriesR: string;
  trackR: string;
  taper: "linear" | "log";
  values: string;
}

function readDraft(d: Draft): { control: unknown } | { error: string } {
  try {
    if (d.kind === "selector") {
      const values = d.values
        .split(/[,;\s]+/)
        .filter(Boolean)
        .map((t, i) => {
          try {
            return parseEng(t);
          } catch {
            throw new Error(`Selector values, entry ${i + 1} ("${t}") is not a number.`);
          }
        });
      return { control: { kind: "selector", field: d.field, values } };
    }
    const num = (label: string, text: string) => {
      try {
        return parseEng(text, "Ω");
      } catch {
        throw new Error(`${label}: "${text}" is not a resistance (e.g. 47k, 2k2).`);
      }
    };
    return {
      control: {
        kind: d.kind,
        field: d.field,
        seriesR: d.seriesR.trim() ? num("Series resistor", d.seriesR) : 0,
        trackR: num("Track resistance", d.trackR),
        ...(d.kind === "pot" ? { taper: d.taper } : {}),
      },
    };
  } catch (e) {
    return { error: (e as Error).message };
  }
}

export function travelFor(
  stage: Stage | null,
  d: Draft,
  field: string,
): { travel: TravelAnalysis } | { error: string } | null {
  if (!stage || d.kind === "none") return null;
  const read = readDraft({ ...d, field });
  if ("error" in read) return read;
  try {
    return { travel: analyzeTravel(stage, read.control) };
  } catch (e) {
    if (isEngineError(e)) return { error: e.message };
    throw e;
  }
}

const inputClass = "mt-1 w-full rounded border border-paper-line px-2 py-1";

export function ControlFields({ stage }: { stage: Stage | null }) {
  const [d, setD] = useState<Draft>({
    kind: "none",
    field: "",
    seriesR: "",
    trackR: "",
    taper: "linear",
    values: "",
  });
  const fields = stage ? (STAGE_FIELDS[stage.kind] ?? []).filter((f) => f.unit !== "bool") : [];
  const choices = d.kind === "selector" ? fields : fields.filter((f) => f.unit === "Ω");
  const field = choices.some((f) => f.name === d.field) ? d.field : (choices[0]?.name ?? "");

  // the React compiler memoises this render-pure call
  const result = travelFor(stage, d, field);
  const travel = result && "travel" in result ? result.travel : null;

  const set = (patch: Partial<Draft>) => setD((x) => ({ ...x, ...patch }));
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
