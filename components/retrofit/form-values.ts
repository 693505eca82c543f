// Stored rows <-> form text, and the one schema the workspace form uses (the
// same stage and target schemas the API validates with, in "zod/mini").
import * as z from "zod/mini";
import type { TargetRow } from "@/db/schema";
import type { GateDrive, Stage, StageControl } from "@/lib/engine";
import type { TargetTrigger } from "@/lib/revisions/types";
import { controlToForm, refineControl, type ControlFormValues } from "@/lib/validation/control";
import { formText } from "@/lib/validation/form-text";
import { customIssue } from "@/lib/validation/issue";
import { stageSchema, stageToForm, type StageFormValues } from "@/lib/validation/stage";
import { targetsSchema, type Target, type TargetInput } from "@/lib/validation/target";

const workspaceShape = z.object({
  stage: stageSchema,
  control: z.optional(z.unknown()),
  targets: targetsSchema,
});
export const workspaceSchema = z.pipe(
  workspaceShape,
  z.transform((input: z.output<typeof workspaceShape>, payload) =>
    refineControl(input, { addIssue: (i) => customIssue(payload, i.message, i.path) }),
  ),
);
export type WorkspaceForm = { stage: StageFormValues; control: ControlFormValues; targets: TargetInput[] };
export type WorkspaceOut = { stage: Stage; control?: StageControl | null; targets: Target[] };

const sText = (v: number | undefined) => (v === undefined ? "" : formText(v));

export function targetToForm(t: TargetRow): TargetInput {
  const tr = (t.trigger ?? {}) as TargetTrigger;
  const g = (t.gateDrive ?? {}) as GateDrive;
  return {
    device: t.device,
    clockSource: t.clockSource,
    clockHz: formText(t.clockHz),
    clockAccuracyPpm: t.clockAccuracyPpm === null ? "" : String(t.clockAccuracyPpm),
    mode: (t.mode ?? "") as TargetInput["mode"],
    timer: t.timer ?? "",
    requiredTolerancePct: t.requiredTolerancePct === null ? "" : String(t.requiredTolerancePct),
    activeLow: t.activeLow,
    start: (tr.start ?? "") as TargetInput["start"],
    delayS: sText(tr.delayS),
    pulseS: sText(tr.pulseS),
    minIntervalS: sText(tr.minIntervalS),
    edge: (tr.edge ?? "") as TargetInput["edge"],
    retrigger: (tr.retrigger ?? "") as TargetInput["retrigger"],
    gateMinS: sText(g.minPulseS),
    gateMaxS: sText(g.maxPulseS),
    gateTrainPeriodS: sText(g.trainPeriodS),
    gateTrainPulses: g.trainPulses === undefined ? "" : String(g.trainPulses),
  };
}

export function toForm(
  stage: Stage | null,
  targets: TargetRow[],
  control: StageControl | null = null,
): WorkspaceForm {
  return { stage: stageToForm(stage), control: controlToForm(control), targets: targets.map(targetToForm) };
}
