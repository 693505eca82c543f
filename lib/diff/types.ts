// Shapes of a revision comparison, shared by the API (JSON), the patch text
// and the compare page.

/** One number (or setting) that differs between two revisions. */
export type NumberChange = {
  /** Stable machine key, e.g. "stage.timingR", "target1.registers.OCR1A". */
  key: string;
  /** Plain label for people, e.g. "Stage timing R", "Target 1 OCR1A". */
  what: string;
  /** Display text with units; "—" when absent on that side. */
  before: string;
  after: string;
  /** Raw values as stored (null when absent). */
  beforeValue: number | string | boolean | null;
  afterValue: number | string | boolean | null;
};

export type DiffLine =
  | { kind: "context"; text: string; oldLine: number; newLine: number }
  | { kind: "removed"; text: string; oldLine: number }
  | { kind: "added"; text: string; newLine: number };

/** A run of unchanged lines left out of the view. Lines are 1-based, inclusive. */
export type FoldRow = { kind: "fold"; count: number; oldFrom: number; newFrom: number };

export type DiffRow = DiffLine | FoldRow;

export type FileStatus = "added" | "removed" | "modified" | "unchanged";

export type FileDiff = {
  path: string;
  status: FileStatus;
  added: number;
  removed: number;
  /** Changed lines with context; unchanged stretches between them folded. */
  rows: DiffRow[];
};

export type RevisionRef = { id: number; number: number; state: string };

/** A side of a comparison whose build is not done: it has its plan (numbers) but no files yet. */
export type UnbuiltSide = { id: number; number: number; buildState: string; buildError: string | null };

export type RevisionComparison = {
  retrofitId: number;
  a: RevisionRef;
  b: RevisionRef;
  numbers: NumberChange[];
  /** Empty while a side is unbuilt (see `unbuilt`): its files are not there to compare yet. */
  files: FileDiff[];
  /** The sides still building or failed; the file text is compared once this is empty. */
  unbuilt?: UnbuiltSide[];
};

/** What the comparison reads from a revision row. */
export type RevisionSnapshot = {
  spec: unknown;
  analysis: unknown;
  plans: unknown;
  files: { path: string; content: string }[];
};
