// Three reading rules the seed-53 mutation sample found unchecked: a headerless
// comma file whose values are all whole numbers (each also reads as one
// decimal-comma number under tab or semicolon), a row of blanks between the
// column names and the data, and the UTF-8 byte count of U+0080 against the
// upload limit.
import { describe, expect, it } from "vitest";
import { parseCapture } from "@/lib/capture";
import { utf8Length } from "@/lib/capture/text-source";
import { captureRefusal } from "./capture-refusal";

/** Ten samples of a 0 / 5 V square wave. */
const SQUARE = [0, 0, 5, 5, 5, 0, 0, 5, 5, 0];

const refusal = captureRefusal;

describe("delimiter of a headerless file", () => {
  it("whole numbers split by commas are two columns, not one column of decimal commas", async () => {
    // capture.md "Input": comma, semicolon or tab separated, decimal commas
    // only where the separator is ";". "3,5" read under tab would be 3.5, so
    // every delimiter finds ten rows of numbers and there is no header text:
    // the tie goes to the delimiter the numbers contain (detect-format.ts,
    // our own rule, common practice, no source).
    const text = SQUARE.map((v, i) => `${i},${v}`).join("\n") + "\n";
    const trace = await parseCapture(text);
    expect(trace.columns).toHaveLength(2);
    expect(trace.columns[0].role).toBe("time");
    // Time steps by 1 (seconds: no unit given) and the second column is the trace.
    expect(Array.from(trace.t)).toEqual(SQUARE.map((_, i) => i));
    expect(Array.from(trace.v)).toEqual(SQUARE);
  });
});

describe("a row of blanks above the data", () => {
  it("is a blank line: the column names above it still name the columns and give their units", async () => {
    // A line holding only spaces is blank like an empty one (the same trim the
    // data start uses; common practice, no source). The names row gives the
    // units (capture.md "Input": units in headers, ms), so times are 1 ms apart.
    const text = ["Time (ms),CH1 (V)", "   ", ...SQUARE.map((v, i) => `${i},${v}`)].join("\n") + "\n";
    const trace = await parseCapture(text);
    expect(trace.columns.map((c) => [c.name, c.unit])).toEqual([
      ["Time", "ms"],
      ["CH1", "V"],
    ]);
    expect(trace.t[1]).toBeCloseTo(1e-3, 15);
    expect(trace.t[9]).toBeCloseTo(9e-3, 15);
  });
});

describe("UTF-8 byte count", () => {
  it("gives each code point the length of its UTF-8 encoding at every boundary of RFC 3629's table", () => {
    // RFC 3629 section 3: U+0000..007F one byte, U+0080..07FF two,
    // U+0800..FFFF three, U+10000..10FFFF four. TextEncoder (WHATWG Encoding
    // Standard, UTF-8 encoder) is the independent count.
    const enc = new TextEncoder();
    for (const ch of ["\u007f", "\u0080", "\u07ff", "\u0800", "\uffff", "\u{10000}", "\u{10ffff}"]) {
      expect(utf8Length(`x${ch}`)).toBe(enc.encode(`x${ch}`).length);
    }
    expect(utf8Length("\u0080")).toBe(2);
  });

  it("refuses an upload holding U+0080 one byte over the limit", async () => {
    const text =
      ["Note: \u0080", "t (s),v (V)", ...SQUARE.map((v, i) => `${i * 1e-6},${v}`)].join("\n") + "\n";
    const bytes = new TextEncoder().encode(text).length; // WHATWG Encoding Standard, UTF-8 encoder
    expect((await parseCapture(text, { maxBytes: bytes })).v.length).toBe(10);
    const e = await refusal(() => parseCapture(text, { maxBytes: bytes - 1 }));
    expect(e.code).toBe("too-large");
    // The product's own message (text-source.ts), naming the limit in bytes and
    // the line reached: a string this short is counted as one slice, before line 1.
    expect(e.line).toBe(1);
    expect(e.message).toBe(`line 1: the capture is larger than the ${bytes - 1} bytes limit`);
  });
});
