"use client";
// How a target's output starts (engine.md section 6): free-running, on a
// trigger edge or on the mains zero crossings, with the delay, pulse, edge and
// retrigger rule, and the thyristor gate's pulse needs. A zero-cross start can
// take its delay from a wanted load power fraction or firing angle.
import { useState } from "react";
import { useFormContext } from "react-hook-form";
import { formText } from "@/lib/validation/form-text";
import { firingDelayFrom, type DelayFrom } from "@/lib/validation/firing-delay";
import type { WorkspaceForm } from "./form-values";

type RowErrors = Record<string, { message?: string } | undefined>;

const TEXT_FIELDS = [
  ["delayS", "Delay, input edge to pulse (s)"],
  ["pulseS", "Output pulse width (s)"],
  ["gateMinS", "Gate pulse at least (s)"],
  ["gateMaxS", "Gate pulse at most (s)"],
] as const;

export function TargetStartFields({ i, errors }: { i: number; errors: RowErrors }) {
  const { register, watch, setValue } = useFormContext<WorkspaceForm>();
  const start = watch(`targets.${i}.start`);
  const mainsHz = watch("stage.sync.mainsHz" as "stage.kind");
  const [from, setFrom] = useState<DelayFrom>("power");
  const [wanted, setWanted] = useState("");
  const [note, setNote] = useState<{ ok: boolean; text: string } | null>(null);
  const id = (name: string) => `target-${i}-${name}`;
  const msg = (name: string) =>
    errors[name]?.message ? (
      <p id={`${id(name)}-error`} className="field-error">
        {errors[name]?.message}
      </p>
    ) : null;
  const triggered = start === "trigger" || start === "zero-cross";

  function applyWanted() {
    const r = firingDelayFrom(from, wanted, mainsHz);
    if (!r.ok) {
      setNote({ ok: false, text: r.message });
      return;
    }
    setValue(`targets.${i}.delayS`, formText(Number(r.delayS.toPrecision(6))), { shouldValidate: true });
    setNote({
      ok: true,
      text: `Delay ${formText(Number(r.delayS.toPrecision(6)))}s: firing angle ${r.angleDeg.toFixed(1)}°, load power ${(r.powerFraction * 100).toFixed(1)} % (resistive load).`,
    });
  }

  return (
    <div className="col-span-full grid grid-cols-[repeat(auto-fill,minmax(15rem,1fr))] gap-3">
      <div>
        <label className="field-label" htmlFor={id("start")}>
          Output starts
        </label>
        <select className="input" id={id("start")} {...register(`targets.${i}.start`)}>
          <option value="">as the stage does (default)</option>
          <option value="free">free-running</option>
          <option value="trigger">on a trigger edge</option>
          <option value="zero-cross">on each mains zero crossing</option>
        </select>
        {msg("start")}
      </div>
      {triggered && (
        <>
          <div>
            <label className="field-label" htmlFor={id("edge")}>
              Input edge
            </label>
            <select className="input" id={id("edge")} {...register(`targets.${i}.edge`)}>
              <option value="">default</option>
              <option value="rising">rising</option>
              <option value="falling">falling</option>
              <option value="both">both (every zero crossing of a square-wave detector)</option>
            </select>
            {msg("edge")}
          </div>
          {start === "trigger" && (
            <div>
              <label className="field-label" htmlFor={id("retrigger")}>
                A trigger while running
              </label>
              <select className="input" id={id("retrigger")} {...register(`targets.${i}.retrigger`)}>
                <option value="">is ignored (default)</option>
                <option value="ignore">is ignored</option>
                <option value="restart">starts the delay again</option>
              </select>
              {msg("retrigger")}
            </div>
          )}
          {TEXT_FIELDS.map(([name, label]) => (
            <div key={name}>
              <label className="field-label" htmlFor={id(name)}>
                {label}
              </label>
              <input
                className="input num"
                autoComplete="off"
                id={id(name)}
                aria-invalid={Boolean(errors[name])}
                aria-describedby={errors[name] ? `${id(name)}-error` : undefined}
                {...register(`targets.${i}.${name}`)}
              />
              {msg(name)}
            </div>
          ))}
        </>
      )}
      {start === "zero-cross" && (
        <div className="rounded border border-paper-line p-2 col-span-full">
          <p className="text-sm font-semibold">Delay from a wanted load power or firing angle</p>
          <div className="mt-1 flex flex-wrap items-end gap-2">
            <select
              className="input w-auto"
              aria-label={`Target ${i + 1}: delay from`}
              value={from}
              onChange={(e) => setFrom(e.target.value as DelayFrom)}
            >
              <option value="power">load power (%)</option>
              <option value="angle">firing angle (°)</option>
            </select>
            <input
              className="input num w-28"
              aria-label={`Target ${i + 1}: wanted ${from === "power" ? "load power in percent" : "firing angle in degrees"}`}
              value={wanted}
              onChange={(e) => setWanted(e.target.value)}
            />
            <button type="button" className="btn text-xs" onClick={applyWanted}>
              Set the delay
            </button>
          </div>
          {note && (
            <p className={note.ok ? "mt-1 text-xs text-ink-soft" : "field-error"} role="status">
              {note.text}
            </p>
          )}
        </div>
      )}
    </div>
  );
}
