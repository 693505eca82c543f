"use client";
// Asset facts: create (POST) or edit (PATCH). The zod schema is the server's.
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { ClientApiError, fetchJson } from "@/lib/client/fetch-json";
import { retrofitFactsSchema, type RetrofitFactsInput } from "@/lib/validation/retrofit";
import type { Retrofit } from "@/db/schema";

const TEXT_FIELDS = [
  { name: "name", label: "Name", hint: "what the stage does, e.g. Sump heater firing stage" },
  { name: "site", label: "Site", hint: "" },
  { name: "assetTag", label: "Asset tag", hint: "" },
  { name: "boardRef", label: "Board reference", hint: "board and part designator" },
] as const;

export function FactsForm({
  initial,
  retrofitId,
  onSaved,
  submitLabel,
}: {
  initial?: Partial<RetrofitFactsInput>;
  retrofitId?: number;
  onSaved: (r: Retrofit) => void;
  submitLabel: string;
}) {
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<RetrofitFactsInput, unknown, import("@/lib/validation/retrofit").RetrofitFacts>({
    resolver: zodResolver(retrofitFactsSchema),
    defaultValues: {
      name: "",
      site: "",
      assetTag: "",
      boardRef: "",
      description: "",
      mainsPowered: false,
      drivesThyristor: false,
      ...initial,
    },
  });

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      const res = await fetchJson<{ retrofit?: Retrofit } & Partial<{ retrofit: Retrofit }>>(
        retrofitId ? `/api/v1/retrofits/${retrofitId}` : "/api/v1/retrofits",
        { method: retrofitId ? "PATCH" : "POST", body: JSON.stringify(values) },
      );
      if (res.retrofit) onSaved(res.retrofit);
    } catch (e) {
      if (e instanceof ClientApiError && e.fields) {
        for (const [k, msg] of Object.entries(e.fields))
          setError(k as keyof RetrofitFactsInput, { message: msg });
      }
      setFormError(e instanceof Error ? e.message : String(e));
    }
  });

  return (
    <form onSubmit={submit} noValidate className="grid gap-3 sm:grid-cols-2" aria-label="Asset facts">
      {TEXT_FIELDS.map((f) => (
        <div key={f.name}>
          <label className="field-label" htmlFor={`facts-${f.name}`}>
            {f.label}
          </label>
          <input
            id={`facts-${f.name}`}
            className="input"
            aria-invalid={Boolean(errors[f.name])}
            aria-describedby={errors[f.name] ? `facts-${f.name}-error` : undefined}
            placeholder={f.hint}
            {...register(f.name)}
          />
          {errors[f.name] && (
            <p id={`facts-${f.name}-error`} className="field-error">
              {errors[f.name]?.message}
            </p>
          )}
        </div>
      ))}
      <div className="sm:col-span-2">
        <label className="field-label" htmlFor="facts-description">
          Description
        </label>
        <textarea id="facts-description" rows={2} className="input" {...register("description")} />
        {errors.description && <p className="field-error">{errors.description.message}</p>}
      </div>
      <fieldset className="sm:col-span-2 flex flex-wrap gap-4 text-sm">
        <legend className="field-label">Hazards</legend>
        <label className="flex items-center gap-2">
          <input type="checkbox" {...register("mainsPowered")} /> Mains-powered board
        </label>
        <label className="flex items-center gap-2">
          <input type="checkbox" {...register("drivesThyristor")} /> Drives a thyristor gate
        </label>
      </fieldset>
      <div className="sm:col-span-2 flex items-center gap-3">
        <button type="submit" className="btn-primary" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : submitLabel}
        </button>
        {formError && (
          <p role="alert" className="field-error mt-0">
            {formError}
          </p>
        )}
      </div>
    </form>
  );
}
