// Public surface of the analog stage models: analyzeStage and its types,
// validation, tolerance spread, engineering notation, E-series, waveform.
export type {
  Stage,
  StageKind,
  StageAnalysis,
  StageCheck,
  StageField,
  StageSpread,
  CheckLevel,
  OutputSignal,
  Tolerance,
  Tolerances,
  MinMax,
  Quantiles,
  Histogram,
  ThresholdStage,
  UjtStage,
  PutStage,
  Timer555AstableStage,
  Timer555MonostableStage,
  SchmittRcStage,
  OpampRelaxationStage,
  TransistorAstableStage,
  MeasuredStage,
} from "./stage-types";
export {
  analyzeStage,
  validateStage,
  withDefaults,
  spreadOf,
  STAGE_KINDS,
  STAGE_FIELDS,
} from "./analyze-stage";
export type { SpreadOptions } from "./analyze-stage";
export {
  cornerSpread,
  monteCarloSpread,
  seededRandom,
  quantile,
  histogram,
  toleranceBounds,
  DEFAULT_SAMPLES,
  DEFAULT_SEED,
} from "./tolerance";
export type { MonteCarloOptions, CornerResult, MonteCarloResult, TimingFn } from "./tolerance";
export { parseEng, formatEng } from "./units";
export type { EngUnit } from "./units";
export { E_SERIES, E_SERIES_TOLERANCE, nearestStandardValue, standardValuesBetween } from "./eseries";
export type { ESeriesName, StandardValue } from "./eseries";
export { stageWaveform } from "./waveform";
export type { WaveformPoint } from "./waveform";
