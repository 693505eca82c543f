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
  MainsSync,
  StageSync,
} from "./stage-types";
export { SYNC_KINDS, SYNC_FIELDS, isSyncable, suggestTimingR } from "./stages/synced";
export type { SyncableStage } from "./stages/synced";
export {
  angleForPowerFraction,
  delayForAngle,
  loadRmsFraction,
  syncCapacitorV,
  firingDelay,
} from "./stages/sync";
export type { SyncCircuit } from "./stages/sync";
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
export { parseEng, formatEng, formatPpm, formatRatio } from "./units";
export type { EngUnit } from "./units";
export { E_SERIES, E_SERIES_TOLERANCE, nearestStandardValue, standardValuesBetween } from "./eseries";
export type { ESeriesName, StandardValue } from "./eseries";
export { stageWaveform } from "./waveform";
export type { WaveformPoint } from "./waveform";
