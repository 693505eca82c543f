"use client";
// Live results of the workspace form: the parsed stage, its analysis and the
// plans, recomputed from the deferred form values so typing stays smooth.
import { useDeferredValue, useMemo } from "react";
import { analyzeStage, isEngineError, type Stage, type StageAnalysis } from "@/lib/engine";
import { planTargets, snapshotOf, type TargetPlanRow } from "@/lib/revisions/plan-targets";
import { stageSchema } from "@/lib/validation/stage";
import { targetSchema } from "@/lib/validation/target";
import type { WorkspaceForm } from "./form-values";
import { plainMessage } from "@/lib/validation/plain-message";

export type Live = {
  stage: Stage | null;
  analysis: StageAnalysis | null;
  error: string | null;
  plans: TargetPlanRow[];
};

export function useLive(values: WorkspaceForm): Live {
  const deferred = useDeferredValue(values);
  const json = JSON.stringify(deferred);
  return useMemo(() => {
    const v = JSON.parse(json) as WorkspaceForm;
    const parsed = stageSchema.safeParse(v.stage);
    if (!parsed.success) {
      return {
        stage: null,
        analysis: null,
        error: "Fix the marked stage fields to see the analysis.",
        plans: [],
      };
    }
    let analysis: StageAnalysis;
    try {
      analysis = analyzeStage(parsed.data);
    } catch (e) {
      if (!isEngineError(e)) throw e;
      return { stage: null, analysis: null, error: plainMessage(e.message, parsed.data.kind), plans: [] };
    }
    const plans: TargetPlanRow[] = planTargets(
      analysis,
      (v.targets ?? [])
        .map((t) => {
          const r = targetSchema.safeParse(t);
          return r.success ? snapshotOf(r.data) : null;
        })
        .filter((t) => t !== null),
    );
    // Rows whose target has field errors are left out; renumber to the form's rows.
    const valid = (v.targets ?? [])
      .map((t, i) => (targetSchema.safeParse(t).success ? i : -1))
      .filter((i) => i >= 0);
    const rows = plans.map((p, k) => ({ ...p, index: valid[k] }));
    return { stage: parsed.data, analysis, error: null, plans: rows };
  }, [json]);
}
