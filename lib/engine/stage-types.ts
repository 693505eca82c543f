// Types of the analog stage models (engine contract, section 4 of the design).
// All quantities are SI base units: ohm, farad, volt, ampere, second, hertz.

/** Relative tolerance: symmetric (0.05 = ±5 %) or asymmetric [minus, plus] ([0.2, 0.8] = −20 %/+80 %). */
export type Tolerance = number | readonly [number, number];
export type Tolerances = Partial<Record<string, Tolerance>>;

interface StageBase {
  tolerances?: Tolerances;
}

/**
 * Mains synchronisation of a threshold, UJT or PUT stage (engine.md section 6):
 * the supply is the full-wave rectified mains clipped at `supplyV` (the zener
 * clamp), and the capacitor starts from 0 V at every zero crossing.
 */
export interface MainsSync {
  mainsHz: number;
  mainsVrms: number;
}

/** What a synchronised stage does in each half cycle (resistive load, full-wave control). */
export interface StageSync {
  halfCycleS: number;
  /** zero crossing to the first firing */
  firingDelayS: number;
  firingAngleDeg: number;
  conductionAngleDeg: number;
  /** load RMS voltage / full-sine RMS: sqrt(1 - a/pi + sin(2a)/(2 pi)) */
  loadRmsFraction: number;
  /** loadRmsFraction squared */
  loadPowerFraction: number;
}

export interface ThresholdStage extends StageBase {
  /** present: synchronised to the mains, supplyV is the clamp voltage */
  sync?: MainsSync;
  kind: "threshold";
  supplyV: number;
  timingR: number;
  timingC: number;
  peakV: number;
  valleyV: number;
  dischargeR: number;
}

export interface UjtStage extends StageBase {
  /** present: synchronised to the mains, supplyV is the clamp voltage */
  sync?: MainsSync;
  kind: "ujt";
  supplyV: number;
  timingR: number;
  timingC: number;
  eta: number;
  diodeV?: number;
  valleyV?: number;
  peakCurrentA?: number;
  valleyCurrentA?: number;
  interbaseR?: number;
  base1R?: number;
  base2R?: number;
}

export interface PutStage extends StageBase {
  /** present: synchronised to the mains, supplyV is the clamp voltage */
  sync?: MainsSync;
  kind: "put";
  supplyV: number;
  timingR: number;
  timingC: number;
  gateUpperR: number;
  gateLowerR: number;
  offsetV?: number;
  valleyV?: number;
  peakCurrentA?: number;
  valleyCurrentA?: number;
  dischargeR?: number;
}

export interface Timer555AstableStage extends StageBase {
  kind: "timer555-astable";
  supplyV: number;
  ra: number;
  rb: number;
  c: number;
  controlV?: number;
  diodeAcrossRb?: boolean;
}

export interface Timer555MonostableStage extends StageBase {
  kind: "timer555-monostable";
  r: number;
  c: number;
}

export interface SchmittRcStage extends StageBase {
  kind: "schmitt-rc";
  supplyV: number;
  r: number;
  c: number;
  vtPlus: number;
  vtMinus: number;
}

export interface OpampRelaxationStage extends StageBase {
  kind: "opamp-relaxation";
  r: number;
  c: number;
  /** output -> non-inverting input */
  feedbackR1: number;
  /** non-inverting input -> ground */
  feedbackR2: number;
}

export interface TransistorAstableStage extends StageBase {
  kind: "transistor-astable";
  supplyV: number;
  r1: number;
  c1: number;
  r2: number;
  c2: number;
}

export interface MeasuredStage extends StageBase {
  kind: "measured";
  periodS: number;
  highS: number;
}

export type Stage =
  | ThresholdStage
  | UjtStage
  | PutStage
  | Timer555AstableStage
  | Timer555MonostableStage
  | SchmittRcStage
  | OpampRelaxationStage
  | TransistorAstableStage
  | MeasuredStage;

export type StageKind = Stage["kind"];

/** Which signal of the old board the replacement must reproduce. */
export type OutputSignal =
  | "pulse-discharge" // generic threshold: pulse across the discharge resistor
  | "pulse-base1" // UJT: positive pulse across R1 (base 1)
  | "pulse-cathode" // PUT: positive pulse across the cathode resistor
  | "rect-output" // rectangular output pin (555, Schmitt gate, transistor collector)
  | "square-bipolar" // op-amp output swinging between ±saturation
  | "one-shot" // a single pulse per trigger
  | "measured-output"; // whatever was measured on the old board

export type CheckLevel = "error" | "warning";

export interface StageCheck {
  level: CheckLevel;
  code: string;
  message: string;
  field?: string;
}

export interface MinMax {
  min: number;
  max: number;
}

export interface Quantiles {
  median: number;
  /** 0.135 % quantile (−3 sigma of a normal distribution) */
  q00135: number;
  /** 99.865 % quantile (+3 sigma) */
  q99865: number;
}

export interface Histogram {
  binStartS: number;
  binWidthS: number;
  counts: number[];
}

export interface StageSpread {
  corners: { count: number; periodS: MinMax; highS: MinMax; failed: number };
  monteCarlo: {
    samples: number;
    seed: number;
    /** samples at which the stage does not oscillate (left out of the statistics) */
    failed: number;
    periodS: Quantiles;
    highS: Quantiles;
    /** histogram of the period */
    histogram: Histogram;
  };
  /** synchronised stages: spread of the firing delay (corners and Monte Carlo; failed = never fires) */
  firingDelayS?: { corners: MinMax; monteCarlo: Quantiles; failed: number };
}

export interface StageAnalysis {
  kind: StageKind;
  /** NaN when the stage does not oscillate (see `checks`) */
  periodS: number;
  highS: number;
  lowS: number;
  frequencyHz: number;
  /** highS / periodS, 0..1 */
  duty: number;
  outputSignal: OutputSignal;
  outputLabel: string;
  /** the model gives a timing (a one-shot counts: it gives its pulse per trigger) */
  oscillates: boolean;
  checks: StageCheck[];
  /** present when the stage carries tolerances and oscillates */
  spread?: StageSpread;
  /** present for a mains-synchronised stage that fires within the half cycle */
  sync?: StageSync;
}

/** One input of a stage, for forms and validation. */
export interface StageField {
  name: string;
  label: string;
  /** "Ω", "F", "V", "A", "s", "Hz" (sync fields only), "" (ratio) or "bool" */
  unit: "Ω" | "F" | "V" | "A" | "s" | "Hz" | "" | "bool";
  optional: boolean;
  default?: number | boolean;
  /** a default that depends on other fields, in words */
  defaultText?: string;
  /** "positive" > 0, "nonNegative" >= 0, "fraction" strictly between 0 and 1 */
  range: "positive" | "nonNegative" | "fraction" | "bool";
}
