// Stored rows <-> form text, and the one schema the workspace form uses (the
// same stage and target schemas the API validates with).
import { z } from "zod";
import type { TargetRow } from "@/db/schema";
import { formatEng, type GateDrive, type Stage } from "@/lib/engine";
import type { TargetTrigger } from "@/lib/revisions/types";
import { stageSchema, stageToForm, type StageFormValues } from "@/lib/validation/stage";
import { targetsSchema, type Target, type TargetInput } from "@/lib/validation/target";

export const workspaceSchema = z.object({ stage: stageSchema, targets: targetsSchema });
export type WorkspaceForm = { stage: StageFormValues; targets: TargetInput[] };
export type WorkspaceOut = { stage: Stage; targets: Target[] };

const sText = (v: number | undefined) => (v === undefined ? "" : formatEng(v, "", 6).replace("µ", "u"));

export function targetToForm(t: TargetRow): TargetInput {
  const tr = (t.trigger ?? {}) as TargetTrigger;
  const g = (t.gateDrive ?? {}) as GateDrive;
  return {
    device: t.device,
    clockSource: t.clockSource,
    clockHz: formatEng(t.clockHz, "", 6).replace("µ", "u"),
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

export function toForm(stage: Stage | null, targets: TargetRow[]): WorkspaceForm {
  return { stage: stageToForm(stage), targets: targets.map(targetToForm) };
}
