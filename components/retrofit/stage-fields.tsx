"use client";
// Inputs of the stage for its kind: value in engineering notation and its
// tolerance in percent, each with its own error line.
import { useFormContext } from "react-hook-form";
import { STAGE_FIELDS, STAGE_KINDS, type EngUnit, type StageKind } from "@/lib/engine";
import { defaultText, echoText } from "@/lib/validation/form-text";
import { stageToForm } from "@/lib/validation/stage";
import type { WorkspaceForm } from "./form-values";
import { StageSyncFields } from "./stage-sync-fields";

const UNIT_TEXT: Record<string, string> = { Ω: "Ω", F: "F", V: "V", A: "A", s: "s", "": "ratio" };

type Errors = Record<string, { message?: string } | Record<string, { message?: string }> | undefined>;

export function StageFields() {
  const { register, watch, getValues, reset, formState } = useFormContext<WorkspaceForm>();
  const kind = watch("stage.kind") as StageKind;
  const errors = (formState.errors.stage ?? {}) as Errors;
  const tolErrors = (errors.tolerances ?? {}) as Record<string, { message?: string }>;
  const fields = STAGE_FIELDS[kind] ?? [];
  const values = watch("stage") as Record<string, unknown> | undefined;

  return (
    <fieldset className="space-y-3">
      <legend className="font-semibold">Old stage</legend>
      <div>
        <label className="field-label" htmlFor="stage-kind">
          Stage kind
        </label>
        <select
          id="stage-kind"
          className="input"
          {...register("stage.kind", {
            onChange: (e) =>
              reset(
                { ...getValues(), stage: stageToForm(null, e.target.value as StageKind) },
                { keepDefaultValues: true },
              ),
          })}
        >
          {STAGE_KINDS.map((k) => (
            <option key={k.kind} value={k.kind}>
              {k.label}
            </option>
          ))}
        </select>
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        {fields.map((f) => {
          const id = `stage-${f.name}`;
          const err = (errors[f.name] as { message?: string } | undefined)?.message;
          const tolErr = tolErrors[f.name]?.message;
          if (f.unit === "bool") {
            return (
              <label key={f.name} className="flex items-center gap-2 text-sm">
                <input type="checkbox" {...register(`stage.${f.name}` as "stage.kind")} /> {f.label}
              </label>
            );
          }
          const unit = f.unit as EngUnit;
          const placeholder =
            typeof f.default === "number" ? defaultText(f.default, unit) : f.defaultText ? f.defaultText : "";
          const echo = echoText(values?.[f.name], unit);
          return (
            <div key={f.name} className="grid grid-cols-[1fr_6rem] gap-2">
              <div>
                <label className="field-label" htmlFor={id}>
                  {f.label} ({UNIT_TEXT[f.unit]}){f.optional ? ", optional" : ""}
                </label>
                <input
                  id={id}
                  className="input num"
                  inputMode="text"
                  autoComplete="off"
                  placeholder={placeholder}
                  aria-invalid={Boolean(err)}
                  aria-describedby={err ? `${id}-error` : echo ? `${id}-echo` : undefined}
                  {...register(`stage.${f.name}` as "stage.kind")}
                />
                {echo && !err && (
                  <p id={`${id}-echo`} className="text-xs text-ink-muted" data-testid={`${id}-echo`}>
                    read as {echo}
                  </p>
                )}
                {err && (
                  <p id={`${id}-error`} className="field-error">
                    {err}
                  </p>
                )}
              </div>
              <div>
                <label className="field-label" htmlFor={`${id}-tol`}>
                  ± %
                </label>
                <input
                  id={`${id}-tol`}
                  aria-label={`${f.label} tolerance in percent`}
                  className="input num"
                  placeholder="0"
                  aria-invalid={Boolean(tolErr)}
                  {...register(`stage.tolerances.${f.name}`)}
                />
                {tolErr && <p className="field-error">{tolErr}</p>}
              </div>
            </div>
          );
        })}
      </div>
      <StageSyncFields />
      <p className="text-xs text-ink-muted">
        Values in engineering notation: 4k7, 100n, 2.2u, 20 V. Tolerances in percent: 5, or -20/+80 for an
        electrolytic.
      </p>
    </fieldset>
  );
}
