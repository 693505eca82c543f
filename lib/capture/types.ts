// Shapes returned by the capture parser and the measurement. All times are in
// seconds and all voltages in volts, whatever units the file used.

/** Summary of a set of measured intervals. std is the sample standard
 *  deviation (n - 1); 0 when count is 1. */
export interface CaptureStats {
  mean: number;
  std: number;
  min: number;
  max: number;
  count: number;
}

export type ColumnRole = "time" | "voltage" | "other";

export interface CaptureColumn {
  name: string;
  /** Unit as written in the header ("" when none); values are rescaled to s / V. */
  unit: string;
  role: ColumnRole;
}

export interface CaptureEdge {
  /** 50 % reference level instant, interpolated. */
  tS: number;
  kind: "rise" | "fall";
}

/** One point of the display envelope: the min and max of the samples it covers. */
export interface PlotPoint {
  tS: number;
  minV: number;
  maxV: number;
}

export interface CaptureWarning {
  code:
    | "few-periods"
    | "edges-capped"
    | "fast-edges"
    | "uneven-sampling"
    | "assumed-time-column"
    | "no-voltage-unit";
  message: string;
}

export interface HeaderEntry {
  key: string;
  value: string;
}

export interface CaptureOptions {
  /** Byte limit while streaming; default MAX_CAPTURE_BYTES. */
  maxBytes?: number;
  /** Which voltage column to measure, 0-based among voltage columns; default 0. */
  voltageColumn?: number;
  /** Probe attenuation the scope did not apply (a 10x probe on a channel
   *  set to 1x): values are multiplied by it. Default 1. A header's "Probe"
   *  line says what the scope already applied and is not applied again. */
  probeAttenuation?: number;
}

/** How the measured column's numbers became volts at the probe tip:
 *  V = (raw × unitScale × scale + offsetV) × probe. */
export interface CaptureScaling {
  /** 0-based among the voltage columns, and how many there are. */
  voltageColumn: number;
  voltageColumns: number;
  /** The unit applied and where it came from ("column" header, a "header" line, or "none": volts assumed). */
  unit: string;
  unitFrom: "column" | "header" | "none";
  unitScale: number;
  /** Header scale factor and offset (1 and 0 when none). */
  scale: number;
  offsetV: number;
  /** Factor applied here (the user's choice; 1 when none). */
  probe: number;
  /** The probe the file says the scope applied (already in the values), or null. */
  headerProbe: number | null;
}

/** A parsed trace: time and the chosen voltage column only. */
export interface CaptureTrace {
  t: Float64Array;
  v: Float64Array;
  columns: CaptureColumn[];
  /** Index into `columns` of the measured column. */
  measuredColumn: number;
  header: HeaderEntry[];
  /** Line of the file holding the first sample. */
  firstDataLine: number;
  /** Absent on traces built by hand (tests). */
  scaling?: CaptureScaling;
  warnings: CaptureWarning[];
}

export interface CaptureMeasurement {
  /** "ramp" for a slow charge with a fast discharge (a UJT emitter), measured cycle by cycle; else "pulse" (IEEE 181 state levels). Absent on older stored measurements (pulse). */
  waveform?: "pulse" | "ramp";
  /** Ramp only: trip (peak) and release (valley) voltages over the cycles. */
  peakV?: CaptureStats;
  valleyV?: CaptureStats;
  samples: number;
  sampleIntervalS: number;
  startS: number;
  durationS: number;
  columns: CaptureColumn[];
  measuredColumn: number;
  /** Absent on measurements stored before units, scale and probe were read. */
  scaling?: CaptureScaling;
  header: HeaderEntry[];
  /** State levels by the histogram method. */
  lowLevelV: number;
  highLevelV: number;
  amplitudeV: number;
  /** Reference levels at 10, 50 and 90 % of the amplitude. */
  referenceV: { p10: number; p50: number; p90: number };
  /** Rising 50 % crossing to the next rising 50 % crossing. */
  periodS: CaptureStats;
  /** Rising 50 % crossing to the next falling one (pulse duration). */
  highS: CaptureStats;
  /** Falling 50 % crossing to the next rising one. */
  lowS: CaptureStats;
  frequencyHz: number;
  /** Mean high time / mean period. */
  duty: number;
  /** Mean 10-90 % transition durations. */
  riseS: number;
  fallS: number;
  riseTimes: CaptureStats;
  fallTimes: CaptureStats;
  /** The first MAX_EDGES transitions; edgesTotal counts all of them. */
  edges: CaptureEdge[];
  edgesTotal: number;
  plot: PlotPoint[];
  warnings: CaptureWarning[];
}
