// JSON shapes of the field and capture API, shared by route handlers and the
// browser components (no server imports here).
import type { CaptureMeasurement, CaptureEdge, PlotPoint } from "@/lib/capture";

export type CheckLine = {
  target: number;
  device: string;
  id: "period" | "high" | "frequency" | "duty";
  label: string;
  unit: "s" | "Hz" | "";
  expected: number;
  min: number;
  max: number;
  measured: number;
  pass: boolean;
  /** Absent on checks stored before limits said where they come from. */
  derived?: boolean;
  source?: string;
};

/** One CHECKLIST.md line as recorded with a check (lib/field/record-steps.ts). */
export type StepResult = {
  id: string;
  section: string;
  text: string;
  kind: "tick" | "measure" | "info";
  expected: string;
  limits: string;
  done: boolean;
  /** As typed ("42 mA"); the bench period/high lines leave it empty and carry `value`. */
  measured: string;
  value: number | null;
  unit: string;
  /** null: not judged (not done, information, or no numeric limit and not ticked). */
  pass: boolean | null;
  note: string;
  photoId?: number;
};

export type FieldCheckView = {
  id: number;
  revisionId: number;
  revisionNumber: number;
  revisionState: string;
  retrofitId: number;
  retrofitName: string;
  assetTag: string;
  boardRef: string;
  /** The target checked (0-based) and its device; null for a check without lines. */
  target: number | null;
  device: string | null;
  technician: { id: number; name: string };
  measuredPeriodS: number | null;
  measuredHighS: number | null;
  captureId: number | null;
  lines: CheckLine[];
  passed: boolean;
  notes: string;
  signedOffBy: string;
  steps: StepResult[];
  createdAt: string;
};

/** The measurement without its display data (plot and edges come from /plot). */
export type MeasurementSummary = Omit<CaptureMeasurement, "plot" | "edges">;

export type CaptureView = {
  id: number;
  retrofitId: number | null;
  uploadedBy: { id: number; name: string };
  fileName: string;
  byteSize: number;
  sha256: string;
  createdAt: string;
  measurement: MeasurementSummary;
};

export type CapturePlot = {
  captureId: number;
  lowLevelV: number;
  highLevelV: number;
  referenceV: { p10: number; p50: number; p90: number };
  startS: number;
  durationS: number;
  points: PlotPoint[];
  edges: CaptureEdge[];
  edgesTotal: number;
  /** samplesPerEntry: samples folded per stored level entry (1 = the samples);
   *  each point spans from its tS to the next point's tS, the last one to untilS (null: the record's end). */
  window: { fromS: number; toS: number; samplesPerEntry: number; untilS: number | null } | null;
};

export type FieldBundle = {
  revisionId: number;
  number: number;
  sha256: string;
  byteSize: number;
  approvedAt: string | null;
  supersededAt: string | null;
  devices: string[];
};

export type FieldAsset = {
  retrofitId: number;
  name: string;
  site: string;
  assetTag: string;
  boardRef: string;
  mainsPowered: boolean;
  drivesThyristor: boolean;
  bundles: FieldBundle[];
};
