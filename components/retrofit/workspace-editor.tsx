"use client";
// Stage + targets form (react-hook-form with the API's zod schemas), live
// analysis and plans, Save and Generate revision with visible progress.
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { FormProvider, useForm, useWatch, type Path, type Resolver } from "react-hook-form";
import type { TargetRow } from "@/db/schema";
import { ClientApiError, fetchJson } from "@/lib/client/fetch-json";
import type { Stage, StageControl } from "@/lib/engine";
import type { BuildStatus } from "@/lib/revisions/build-state";
import { AnalysisPanel } from "./analysis-panel";
import { toForm, workspaceSchema, type WorkspaceForm, type WorkspaceOut } from "./form-values";
import { useLive } from "./live";
import { useUnsavedGuard } from "./use-unsaved-guard";
import { PlansTable } from "./plans-table";
import { StageFields } from "./stage-fields";
import { TargetsFields } from "./targets-fields";

type Phase =
  | { kind: "idle" }
  | { kind: "saving"; then: "generate" | null }
  | { kind: "generating"; number: number }
  | { kind: "saved" }
  | { kind: "building"; id: number; number: number; done: number; total: number }
  | { kind: "generated"; id: number; number: number }
  | { kind: "failed"; message: string; fields?: Record<string, string> };

export function WorkspaceEditor(props: {
  retrofitId: number;
  stage: Stage | null;
  control?: StageControl | null;
  targets: TargetRow[];
  editable: boolean;
  nextNumber: number;
  onChanged: () => void;
}) {
  const form = useForm<WorkspaceForm, unknown, WorkspaceOut>({
    resolver: zodResolver(workspaceSchema) as unknown as Resolver<WorkspaceForm, unknown, WorkspaceOut>,
    defaultValues: toForm(props.stage, props.targets, props.control ?? null),
    mode: "onChange",
  });
  const values = useWatch({ control: form.control }) as WorkspaceForm;
  const live = useLive(values);
  const [phase, setPhase] = useState<Phase>({ kind: "idle" });
  const busy = phase.kind === "saving" || phase.kind === "generating" || phase.kind === "building";
  useUnsavedGuard(props.editable && form.formState.isDirty);

  function showServerError(e: unknown) {
    const fields = e instanceof ClientApiError ? e.fields : undefined;
    for (const [k, msg] of Object.entries(fields ?? {})) {
      form.setError(k as Path<WorkspaceForm>, { message: msg });
    }
    setPhase({ kind: "failed", message: e instanceof Error ? e.message : String(e), fields });
  }

  const run = (then: "generate" | null) =>
    form.handleSubmit(
      async (out) => {
        setPhase({ kind: "saving", then });
        try {
          await fetchJson(`/api/v1/retrofits/${props.retrofitId}`, {
            method: "PATCH",
            body: JSON.stringify({ stage: out.stage, control: out.control ?? null, targets: out.targets }),
          });
          // What is stored now is the new baseline: leaving no longer asks.
          form.reset(form.getValues());
          if (!then) {
            setPhase({ kind: "saved" });
            props.onChanged();
            return;
          }
          setPhase({ kind: "generating", number: props.nextNumber });
          const res = await fetchJson<{ revision: { id: number; number: number } }>(
            `/api/v1/retrofits/${props.retrofitId}/revisions`,
            { method: "POST", body: JSON.stringify({}) },
          );
          // 202: the revision exists and a worker builds it; follow its progress here.
          const { id, number } = res.revision;
          props.onChanged();
          for (;;) {
            const st = await fetchJson<BuildStatus>(`/api/v1/revisions/${id}/build`);
            if (st.buildState === "ready") break;
            if (st.buildState === "failed") {
              const fields = Object.fromEntries(
                st.targets
                  .filter((t) => t.step === "failed")
                  .map((t) => [`targets.${t.index}`, t.reason ?? ""]),
              );
              throw new ClientApiError(
                `r${number} did not build: ${st.buildError ?? ""}`,
                422,
                "build_failed",
                fields,
              );
            }
            const done = st.targets.filter((t) => ["compiled", "emulating", "done"].includes(t.step)).length;
            setPhase({ kind: "building", id, number, done, total: st.targets.length });
            await new Promise((r) => setTimeout(r, 1000));
          }
          setPhase({ kind: "generated", id, number });
          props.onChanged();
        } catch (e) {
          showServerError(e);
        }
      },
      () =>
        setPhase({
          kind: "failed",
          message: "Some fields are not valid; fix the marked fields and try again.",
        }),
    );

  return (
    <FormProvider {...form}>
      <div className="grid gap-4 lg:grid-cols-2">
        <form className="panel space-y-5" noValidate onSubmit={run(null)} aria-label="Stage and targets">
          <fieldset disabled={!props.editable || busy} className="space-y-5">
            <StageFields />
            <TargetsFields disabled={!props.editable} />
          </fieldset>
          {props.editable && (
            <div className="flex flex-wrap items-center gap-3 border-t border-paper-line pt-3">
              <button type="submit" className="btn" disabled={busy}>
                Save
              </button>
              <button type="button" className="btn-primary" disabled={busy} onClick={run("generate")}>
                Generate revision r{props.nextNumber}
              </button>
              <Progress phase={phase} />
            </div>
          )}
        </form>
        <AnalysisPanel stage={live.stage} analysis={live.analysis} error={live.error} />
      </div>
      <PlansTable rows={live.plans} />
    </FormProvider>
  );
}

function Progress({ phase }: { phase: Phase }) {
  switch (phase.kind) {
    case "idle":
      return null;
    case "saving":
      return (
        <span role="status" className="flex items-center gap-2 text-sm">
          <progress aria-label="Saving" className="h-2 w-24" /> Saving stage and targets…
        </span>
      );
    case "generating":
      return (
        <span role="status" className="flex items-center gap-2 text-sm">
          <progress aria-label="Generating" className="h-2 w-24" /> Generating r{phase.number}: planning,
          writing files, zipping…
        </span>
      );
    case "building":
      return (
        <span role="status" className="flex items-center gap-2 text-sm">
          <progress aria-label="Building" className="h-2 w-24" max={phase.total} value={phase.done} />{" "}
          Building{" "}
          <Link className="underline" href={`/revisions/${phase.id}`}>
            r{phase.number}
          </Link>
          : {phase.done} of {phase.total} targets compiled…
        </span>
      );
    case "saved":
      return (
        <span role="status" className="text-sm text-ok">
          Saved.
        </span>
      );
    case "generated":
      return (
        <span role="status" className="text-sm text-ok">
          Generated{" "}
          <Link className="underline" href={`/revisions/${phase.id}`}>
            r{phase.number}
          </Link>
          .
        </span>
      );
    case "failed":
      return (
        <div role="alert" className="field-error mt-0 w-full">
          <p>{phase.message}</p>
          {phase.fields && (
            <ul className="list-disc pl-5">
              {Object.entries(phase.fields).map(([k, m]) => (
                <li key={k}>
                  {k}: {m}
                </li>
              ))}
            </ul>
          )}
        </div>
      );
  }
}
