"use client";
// Mains synchronisation of a UJT, PUT or threshold stage (engine.md section
// 6): mains frequency and RMS voltage. Both blank = free-running. With them
// the stage's supply voltage is the clamp (zener) voltage.
import { useFormContext } from "react-hook-form";
import { SYNC_FIELDS, SYNC_KINDS, type StageKind } from "@/lib/engine";
import type { WorkspaceForm } from "./form-values";

type SyncErrors = Record<string, { message?: string } | undefined>;

export function StageSyncFields() {
  const { register, watch, formState } = useFormContext<WorkspaceForm>();
  const kind = watch("stage.kind") as StageKind;
  if (!(SYNC_KINDS as readonly string[]).includes(kind)) return null;
  const errors = ((formState.errors.stage as Record<string, unknown> | undefined)?.sync ?? {}) as SyncErrors;
  return (
    <div className="rounded border border-paper-line p-3">
      <p className="text-sm font-semibold">Synchronised to the mains</p>
      <p className="mb-2 text-xs text-ink-soft">
        Fill both for a phase-control firing stage fed from the rectified, clamped mains (the supply voltage
        above is then the clamp voltage). Leave both blank for a free-running stage.
      </p>
      <div className="grid gap-3 sm:grid-cols-2">
        {SYNC_FIELDS.map((f) => {
          const id = `stage-sync-${f.name}`;
          const err = errors[f.name]?.message;
          return (
            <div key={f.name}>
              <label className="field-label" htmlFor={id}>
                {f.label} ({f.unit})
              </label>
              <input
                id={id}
                className="input num"
                autoComplete="off"
                aria-invalid={Boolean(err)}
                aria-describedby={err ? `${id}-error` : undefined}
                {...register(`stage.sync.${f.name}` as "stage.kind")}
              />
              {err && (
                <p id={`${id}-error`} className="field-error">
                  {err}
                </p>
              )}
            </div>
          );
        })}
      </div>
    </div>
  );
}
