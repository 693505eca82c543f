// Streams an export into two growing Float64Arrays (time and the measured
// voltage). Lines are read one at a time and dropped; only the first
// WINDOW_LINES are held, to work out the format.

import { detectLayout, type Layout } from "./detect-format";
import { CaptureError } from "./errors";
import { fastNumber } from "./fast-number";
import { readNumber } from "./fields";
import { LineSplitter } from "./line-splitter";
import { MAX_CAPTURE_BYTES, textChunks } from "./text-source";
import type { CaptureOptions, CaptureTrace } from "./types";

/** Lines looked at before the format is fixed; header blocks are shorter. */
export const WINDOW_LINES = 200;

class Series {
  private buf = new Float64Array(1 << 16);
  length = 0;

  push(x: number): void {
    if (this.length === this.buf.length) {
      const grown = new Float64Array(this.buf.length * 2);
      grown.set(this.buf);
      this.buf = grown;
    }
    this.buf[this.length++] = x;
  }

  values(): Float64Array {
    return this.buf.subarray(0, this.length);
  }
}

const HAS_DIGIT = /\d/;

class RowReader {
  private readonly t = new Series();
  private readonly v = new Series();
  private prevT = -Infinity;
  private prevLine = 0;
  private minStep = Infinity;
  private maxStep = 0;
  private firstLine = 0;
  private readonly trailing: RegExp;
  private readonly decimalMark: number;

  constructor(private readonly layout: Layout) {
    this.trailing = layout.delimiter === "\t" ? /^\s*$/ : new RegExp(`^[\\s${layout.delimiter}]*$`);
    this.decimalMark = layout.decimalComma ? 44 : 46;
  }

  /** Reads the row text[start, end). */
  row(text: string, start: number, end: number, lineNo: number): void {
    if (start === end) return;
    if (text.charCodeAt(start) <= 32 && text.slice(start, end).trim() === "") return;
    const { delimiter, fieldCount, timeIndex, measuredIndex } = this.layout;
    let pos = start;
    let tRaw = 0;
    let vRaw = 0;
    const last = fieldCount - 1;
    for (let c = 0; c < fieldCount; c++) {
      // The last field runs to the line end without a search: for one-column
      // data a search would scan the rest of the chunk on every line.
      const fieldEnd = c < last ? text.indexOf(delimiter, pos) : end;
      if (fieldEnd === -1 || fieldEnd > end) {
        throw new CaptureError(
          "column-count",
          lineNo,
          `${c + 1} value(s) where the data has ${fieldCount} columns`,
        );
      }
      let x = fastNumber(text, pos, fieldEnd, this.decimalMark);
      if (x !== x) {
        x = this.number(
          c < last ? text.slice(pos, fieldEnd) : this.lastField(text.slice(pos, end), lineNo),
          c,
          lineNo,
        );
      }
      if (c === timeIndex) tRaw = x;
      if (c === measuredIndex) vRaw = x;
      pos = fieldEnd + 1;
    }
    if (this.firstLine === 0) this.firstLine = lineNo;
    if (timeIndex >= 0) this.pushTime(tRaw * this.layout.scales[timeIndex], lineNo);
    this.v.push(vRaw * this.layout.measuredScale + this.layout.measuredOffset);
  }

  /** The last field without trailing empty fields; more values are an error. */
  private lastField(field: string, lineNo: number): string {
    const cut = field.indexOf(this.layout.delimiter);
    if (cut === -1) return field;
    if (!this.trailing.test(field.slice(cut))) {
      throw new CaptureError(
        "column-count",
        lineNo,
        `more values than the ${this.layout.fieldCount} columns of the data`,
      );
    }
    return field.slice(0, cut);
  }

  private number(field: string, column: number, lineNo: number): number {
    let x = Number(field);
    // Number() reads "" and blanks as 0 and fails on decimal commas and quotes.
    if (x !== x || (x === 0 && !HAS_DIGIT.test(field))) {
      x = readNumber(field, this.layout.decimalComma);
    }
    if (Number.isFinite(x)) return x;
    const name = this.layout.columns[column].name;
    const text = field.trim();
    throw new CaptureError(
      "not-a-number",
      lineNo,
      text === ""
        ? `column ${column + 1} ("${name}") is empty`
        : `"${text.slice(0, 40)}" in column ${column + 1} ("${name}") is not a finite number`,
    );
  }

  private pushTime(t: number, lineNo: number): void {
    if (t < this.prevT) {
      throw new CaptureError(
        "non-monotonic-time",
        lineNo,
        `time ${t} s is earlier than ${this.prevT} s on line ${this.prevLine}; time must not go backwards`,
      );
    }
    if (this.prevLine > 0) {
      const step = t - this.prevT;
      if (step < this.minStep) this.minStep = step;
      if (step > this.maxStep) this.maxStep = step;
    }
    this.prevT = t;
    this.prevLine = lineNo;
    this.t.push(t);
  }

  finish(): CaptureTrace {
    const { layout } = this;
    const v = this.v.values();
    const n = v.length;
    const warnings = [...layout.warnings];
    let t: Float64Array;
    if (layout.timeIndex >= 0) {
      t = this.t.values();
      if (n >= 2 && t[n - 1] <= t[0]) {
        throw new CaptureError(
          "non-monotonic-time",
          this.firstLine,
          `time stays at ${t[0]} s over all ${n} rows; it must advance`,
        );
      }
      const mean = n >= 2 ? (t[n - 1] - t[0]) / (n - 1) : 0;
      if (n >= 3 && (this.maxStep > 1.5 * mean || this.minStep < 0.5 * mean)) {
        warnings.push({
          code: "uneven-sampling",
          message: `time steps range from ${this.minStep} s to ${this.maxStep} s around a mean of ${mean} s`,
        });
      }
    } else {
      const dt = layout.sampleIntervalS ?? 1;
      t = new Float64Array(n);
      for (let i = 0; i < n; i++) t[i] = layout.startS + i * dt;
    }
    return {
      t,
      v,
      columns: layout.columns,
      measuredColumn: layout.measuredIndex,
      header: layout.header,
      firstDataLine: this.firstLine,
      scaling: layout.scaling,
      warnings,
    };
  }
}

/** Reads an export into a trace of the chosen voltage column. */
export async function parseCapture(
  source: string | AsyncIterable<Uint8Array | string>,
  options: CaptureOptions = {},
): Promise<CaptureTrace> {
  const maxBytes = options.maxBytes ?? MAX_CAPTURE_BYTES;
  const window: string[] = [];
  let reader: RowReader | null = null;
  const startRows = (): RowReader => {
    const layout = detectLayout(window, {
      voltageColumn: options.voltageColumn ?? 0,
      probeAttenuation: options.probeAttenuation,
    });
    const r = new RowReader(layout);
    for (let i = layout.dataStart; i < window.length; i++) {
      r.row(window[i], 0, window[i].length, i + 1);
    }
    window.length = 0;
    return r;
  };
  const splitter = new LineSplitter((text, start, end, lineNo) => {
    if (reader) reader.row(text, start, end, lineNo);
    else {
      window.push(text.slice(start, end));
      if (window.length >= WINDOW_LINES) reader = startRows();
    }
  });
  for await (const text of textChunks(source, maxBytes, () => splitter.lines + 1)) {
    splitter.push(text);
  }
  splitter.end();
  return (reader ?? startRows()).finish();
}
