// Splits decoded text chunks into lines without ever holding an array of
// lines: each complete line goes straight to the handler as a range of the
// chunk text (no substring per line), only the unfinished tail of the last
// chunk is kept.

import { CaptureError } from "./errors";

/** Longer than any CSV row of a scope trace; stops a binary blob without
 *  newlines from growing the carry without bound. */
export const MAX_LINE_CHARS = 65536;

// Control characters never found in a text export (tab, LF, FF, CR allowed).
const BINARY_CHARS = /[\u0000-\u0008\u000b\u000e-\u001f]/;

export class LineSplitter {
  private carry = "";
  private started = false;
  private newline = "\n";
  /** Number of lines handed to the handler so far. */
  lines = 0;

  constructor(private readonly onLine: (text: string, start: number, end: number, lineNo: number) => void) {}

  push(chunk: string): void {
    let text = this.carry + chunk;
    if (!this.started && text.length > 0) {
      this.started = true;
      if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
      // Files with bare CR line ends (no LF at all in the first chunk).
      if (!text.includes("\n") && text.includes("\r")) this.newline = "\r";
    }
    this.checkBinary(chunk);
    const nl = this.newline;
    let start = 0;
    let at = text.indexOf(nl, start);
    while (at !== -1) {
      let end = at;
      if (nl === "\n" && end > start && text.charCodeAt(end - 1) === 13) end--;
      this.emit(text, start, end);
      start = at + 1;
      at = text.indexOf(nl, start);
    }
    this.carry = start === 0 ? text : text.slice(start);
    if (this.carry.length > MAX_LINE_CHARS) {
      throw new CaptureError(
        "line-too-long",
        this.lines + 1,
        `a line longer than ${MAX_LINE_CHARS} characters; not a trace export`,
      );
    }
  }

  /** Hands over the last line when the input does not end with a newline. */
  end(): void {
    if (this.carry.length > 0) {
      const text = this.carry.endsWith("\r") ? this.carry.slice(0, -1) : this.carry;
      this.carry = "";
      this.emit(text, 0, text.length);
    }
  }

  private emit(text: string, start: number, end: number): void {
    if (end - start > MAX_LINE_CHARS) {
      throw new CaptureError(
        "line-too-long",
        this.lines + 1,
        `a line longer than ${MAX_LINE_CHARS} characters; not a trace export`,
      );
    }
    this.lines++;
    this.onLine(text, start, end, this.lines);
  }

  /** Names the line holding the first control byte of the new chunk. */
  private checkBinary(chunk: string): void {
    const m = BINARY_CHARS.exec(chunk);
    if (!m) return;
    // The carry holds no newline, so lines + 1 is the line the chunk starts in.
    const before = chunk.slice(0, m.index);
    let line = this.lines + 1;
    for (let i = before.indexOf(this.newline); i !== -1; i = before.indexOf(this.newline, i + 1)) {
      line++;
    }
    throw new CaptureError(
      "binary",
      line,
      `control byte 0x${m[0].charCodeAt(0).toString(16).padStart(2, "0")}: this is a binary file, not a CSV or TSV text export`,
    );
  }
}
