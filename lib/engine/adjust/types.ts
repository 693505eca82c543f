// Types of an adjustable stage value: a rate potentiometer, a trimmer set
// once at commissioning, or a selector switch of values. SI units, like the
// stage models they feed.

/** How the resistance of a potentiometer track follows its rotation. */
export type Taper = "linear" | "log";

/**
 * A potentiometer wired as a variable resistor (wiper tied to one end) in
 * place of one resistive field of the stage. The field's value at rotation x
 * (0 = fully anticlockwise, 1 = fully clockwise) is
 * `seriesR + trackR * taperFraction(taper, x)`.
 */
export interface PotControl {
  kind: "pot";
  /** the stage field the control sets, e.g. "timingR", "rb", "r" */
  field: string;
  /** fixed resistor in series with the track (keeps the stage inside its limits at one end) */
  seriesR: number;
  /** end-to-end track resistance */
  trackR: number;
  taper: Taper;
}

/** A trimmer: a linear track set once at commissioning, then left alone. */
export interface TrimmerControl {
  kind: "trimmer";
  field: string;
  seriesR: number;
  trackR: number;
}

/** A selector switch choosing one of a list of values (capacitors, resistors). */
export interface SelectorControl {
  kind: "selector";
  field: string;
  /** the value at each switch position, in switch order */
  values: readonly number[];
}

export type StageControl = PotControl | TrimmerControl | SelectorControl;

/** The timing the control moves: the period of a free-running stage, the firing delay of a mains-synchronised one. */
export type TravelQuantity = "periodS" | "firingDelayS";

export interface TravelPoint {
  /** rotation 0..1 (pot, trimmer) or switch position index (selector) */
  position: number;
  /** the stage field's value there */
  value: number;
  /** NaN where the stage does not run */
  timingS: number;
  highS: number;
  /** corner extremes of the timing with the stage's tolerances; absent without tolerances or where the stage stops */
  band?: { min: number; max: number };
  oscillates: boolean;
  /** the model's error explanation where it does not run */
  reason?: string;
}

/** A position on the travel where the stage starts or stops running. */
export interface TravelLimit {
  position: number;
  value: number;
  /** "stops-above": runs below this position only; "stops-below": runs above it only */
  side: "stops-above" | "stops-below";
}

export interface TravelCheck {
  level: "error" | "warning";
  code: string;
  message: string;
  /** the input the message is about, e.g. "control.trackR" */
  field: string;
}

export interface TravelAnalysis {
  control: StageControl;
  quantity: TravelQuantity;
  points: TravelPoint[];
  limits: TravelLimit[];
  /** the running part of the travel */
  runningRange: { minS: number; maxS: number } | null;
  checks: TravelCheck[];
}
