// Typed capture errors. Every refusal to read or measure a capture is one of
// these: callers map `code` to a 4xx status and show `message`, which names
// the line of the file where reading stopped (null when the whole trace,
// not one line, is the problem).

export type CaptureErrorCode =
  | "empty" // no bytes, or only blank lines
  | "binary" // NUL or other control bytes: not a text export
  | "too-large" // more bytes than the size limit
  | "line-too-long" // a line longer than any CSV row of a trace
  | "no-numeric-data" // no rows of numbers found
  | "one-column" // numbers but no time column and no sample interval
  | "column-count" // a data row with fewer or more values than the others
  | "not-a-number" // a value that does not read as a finite number
  | "non-monotonic-time" // time goes backwards, or never advances
  | "flat" // the measured trace has one level only
  | "no-period" // fewer than two rising 50 % crossings
  | "bad-choice"; // a channel or probe attenuation the capture cannot have

export class CaptureError extends Error {
  readonly code: CaptureErrorCode;
  /** 1-based line of the file, or null when no single line is at fault. */
  readonly line: number | null;

  constructor(code: CaptureErrorCode, line: number | null, detail: string) {
    super(line === null ? detail : `line ${line}: ${detail}`);
    this.name = "CaptureError";
    this.code = code;
    this.line = line;
  }
}

export function isCaptureError(value: unknown): value is CaptureError {
  return value instanceof CaptureError;
}
