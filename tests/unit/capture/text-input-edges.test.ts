// Text-level edges of an upload: the byte count of a string that holds
// characters outside the BMP, a binary file whose second byte is 0xFF, a
// field of blanks, a "name / unit" header without a blank after the slash and
// a blank line inside headerless data with a sample interval.
import { describe, expect, it } from "vitest";
import { parseCapture } from "@/lib/capture";
import { utf8Length } from "@/lib/capture/text-source";
import { splitNameUnit } from "@/lib/capture/units";
import { captureRefusal } from "./capture-refusal";

const refusal = captureRefusal;

describe("text input edges", () => {
  it("a character outside the BMP counts 4 bytes even where the string is read in 1 MiB slices", async () => {
    // U+1F600 is one code point, 4 bytes in UTF-8 (RFC 3629 section 3) and a
    // surrogate pair in a JS string (ECMA-262, The String Type; from memory). Placed so its high
    // surrogate is the last code unit of the first 1 MiB slice (1 << 20, the
    // slice size in text-source.ts): the pair must stay in one slice.
    const head = "t (s),v (V)\n";
    const rows = Array.from({ length: 40 }, (_, i) => `${i * 1e-6},${Math.floor(i / 5) % 2 ? 5 : 0}`);
    const note = "Note: ";
    const padLines: string[] = [];
    let used = note.length;
    const target = (1 << 20) - 1; // index of the high surrogate
    while (target - used > 60000) {
      padLines.push("Note: " + "x".repeat(59990));
      used += padLines[padLines.length - 1].length + 1;
    }
    padLines.push(note + "y".repeat(target - used) + "\u{1F600} end");
    const text = padLines.join("\n") + "\n" + head + rows.join("\n") + "\n";
    expect(text.charCodeAt(target)).toBe(0xd83d); // the pair sits across the slice end
    const bytes = utf8Length(text);
    expect(bytes).toBe(text.length + 2); // 2 UTF-16 code units -> 4 UTF-8 bytes
    // At exactly its own size the capture is within the limit.
    const trace = await parseCapture(text, { maxBytes: bytes });
    expect(trace.v.length).toBe(40);
  });

  it("a binary file starting 00 FF has no byte-order mark and is read as UTF-8, so refused as binary", async () => {
    // FE FF is the UTF-16BE byte-order mark, FF FE UTF-16LE (Unicode Standard,
    // "Byte Order Mark", from memory); 00 FF is neither, so the bytes are UTF-8 and
    // the NUL is a control byte no text export has.
    const bytes = new Uint8Array([0x00, 0xff, 0x00, 0x30, 0x00, 0x2c, 0x00, 0x31, 0x00, 0x0a]);
    async function* one() {
      yield bytes;
    }
    const e = await refusal(() => parseCapture(one()));
    expect(e.code).toBe("binary");
    expect(e.message).toContain("control byte 0x00");
  });

  it("a field of blanks is an empty value, not zero", async () => {
    // The product's own message for an empty field (parse-lines.ts, which
    // reads "" and blanks alike as no value, not as Number()'s 0).
    const e = await refusal(() => parseCapture("t (s),v (V),w (V)\n0,1,2\n1e-6,   ,2\n2e-6,1,2\n"));
    expect(e.code).toBe("not-a-number");
    expect(e.line).toBe(3);
    expect(e.message).toContain('column 2 ("v") is empty');
  });

  it('"t/us" and "t / us" both give the unit us', () => {
    // Name and unit split at a slash, the quantity / unit notation of table
    // heads (ISO 80000-1, from memory), with or without blanks (units.ts).
    expect(splitNameUnit("t/us")).toEqual({ name: "t", unit: "us" });
    expect(splitNameUnit("t / us")).toEqual({ name: "t", unit: "us" });
    expect(splitNameUnit("CH1/mV")).toEqual({ name: "CH1", unit: "mV" });
  });

  it("a blank line in headerless data does not stop the first column reading as time", async () => {
    // capture.md "Input": exports without a time column but a sample interval
    // in the header are accepted; a first column stepping by that interval is
    // the time (detect-format.ts), blank lines are skipped like everywhere else.
    const rows = Array.from({ length: 12 }, (_, i) => `${i * 1e-6},${Math.floor(i / 3) % 2 ? 5 : 0}`);
    rows.splice(6, 0, "");
    const trace = await parseCapture("Sample interval: 1e-6\n" + rows.join("\n") + "\n");
    expect(trace.columns[0].role).toBe("time");
    expect(trace.t[11]).toBeCloseTo(11e-6, 15);
    expect(trace.v.length).toBe(12);
  });
});
