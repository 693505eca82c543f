// Registry of the stage models, one per kind.
import type { Stage, StageKind } from "../stage-types";
import type { StageModel } from "./model";
import { measuredModel } from "./measured";
import { opampRelaxationModel } from "./opamp-relaxation";
import { putModel } from "./put";
import { schmittRcModel } from "./schmitt-rc";
import { thresholdModel } from "./threshold";
import { timer555AstableModel } from "./timer555-astable";
import { timer555MonostableModel } from "./timer555-monostable";
import { transistorAstableModel } from "./transistor-astable";
import { ujtModel } from "./ujt";

type ModelMap = { [K in StageKind]: StageModel<Extract<Stage, { kind: K }>> };

export const STAGE_MODELS: ModelMap = {
  threshold: thresholdModel,
  ujt: ujtModel,
  put: putModel,
  "timer555-astable": timer555AstableModel,
  "timer555-monostable": timer555MonostableModel,
  "schmitt-rc": schmittRcModel,
  "opamp-relaxation": opampRelaxationModel,
  "transistor-astable": transistorAstableModel,
  measured: measuredModel,
};

export function modelOf<S extends Stage>(stage: S): StageModel<S> {
  return STAGE_MODELS[stage.kind] as unknown as StageModel<S>;
}
