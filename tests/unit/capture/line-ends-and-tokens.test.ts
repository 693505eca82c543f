// Text-level details of an export: a byte order mark, bare CR line ends, the
// non-finite tokens C runtimes print and a row with more values than columns.
// U+FEFF at the start of a file is the byte order mark (The Unicode Standard,
// chapter 23 "Special Areas and Format Characters", from memory); bare CR line
// ends come from old Mac software (common practice, no source); "1.#INF",
// "-1.#IND" and "1.#QNAN" are how the Microsoft C runtime printed infinity,
// indeterminate and quiet NaN before 2015 (from memory).
import { describe, expect, it } from "vitest";
import { parseCapture } from "@/lib/capture";
import { captureRefusal } from "./capture-refusal";

const refusal = (text: string) => captureRefusal(() => parseCapture(text));

/** A 0 / 5 V square wave, 1 us a sample, as "t,v" rows. */
function rows(n: number): string[] {
  return Array.from({ length: n }, (_, i) => `${i * 1e-6},${Math.floor(i / 5) % 2 ? 5 : 0}`);
}

describe("line ends and the byte order mark", () => {
  it("a leading byte order mark is not part of the first column's name", async () => {
    const trace = await parseCapture("\uFEFFTime (s),CH1 (V)\n" + rows(20).join("\n"));
    expect(trace.columns.map((c) => c.name)).toEqual(["Time", "CH1"]);
    expect(trace.header).toEqual([]);
    expect(trace.t.length).toBe(20);
  });

  it("the mark before a header line leaves its key readable", async () => {
    const text = "\uFEFFSample Interval,2E-06\nCH1\n" + ["0", "5", "0", "5"].join("\n");
    const trace = await parseCapture(text);
    expect(trace.header).toEqual([{ key: "Sample Interval", value: "2E-06" }]);
    expect(trace.t[1] - trace.t[0]).toBeCloseTo(2e-6, 18);
  });

  it("bare CR line ends read as lines", async () => {
    const trace = await parseCapture(["Time (s),CH1 (V)", ...rows(20)].join("\r"));
    expect(trace.t.length).toBe(20);
    expect(trace.t[19]).toBeCloseTo(19e-6, 18);
    expect(Array.from(trace.v.slice(0, 6))).toEqual([0, 0, 0, 0, 0, 5]);
  });

  it("CR LF line ends read the same as LF", async () => {
    const lf = await parseCapture(["Time (s),CH1 (V)", ...rows(20)].join("\n"));
    const crlf = await parseCapture(["Time (s),CH1 (V)", ...rows(20)].join("\r\n"));
    expect(Array.from(crlf.v)).toEqual(Array.from(lf.v));
    expect(Array.from(crlf.t)).toEqual(Array.from(lf.t));
  });
});

describe("non-finite tokens in the data rows", () => {
  it.each(["1.#INF", "-1.#INF", "-1.#IND", "1.#QNAN", "inf", "-Infinity", "NaN"])(
    "%s in the first data row is a bad value on its line, not a header line",
    async (token) => {
      // Read as text, the row would become a header line above the data and
      // the names row above it would be lost: the file would be accepted.
      const lines = ["Time (s),CH1 (V)", ...rows(40)];
      lines[1] = `0,${token}`;
      const e = await refusal(lines.join("\n"));
      expect(e.code).toBe("not-a-number");
      expect(e.line).toBe(2);
      expect(e.message).toBe(`line 2: "${token}" in column 2 ("CH1") is not a finite number`);
      // and further down the first rows
      lines[1] = "0,0";
      lines[3] = `2e-6,${token}`;
      const later = await refusal(lines.join("\n"));
      expect(later.line).toBe(4);
    },
  );
});

describe("rows with extra values", () => {
  it("the refusal names the line and the data's column count", async () => {
    const lines = ["Time (s),CH1 (V)", ...rows(300)];
    lines[220] = `${219e-6},0,7`;
    const e = await refusal(lines.join("\n"));
    expect(e.code).toBe("column-count");
    expect(e.line).toBe(221);
    expect(e.message).toBe("line 221: more values than the 2 columns of the data");
    // Negative case: trailing delimiters are not extra values.
    lines[220] = `${219e-6},0,,`;
    const ok = await parseCapture(lines.join("\n"));
    expect(ok.t.length).toBe(300);
  });
});
