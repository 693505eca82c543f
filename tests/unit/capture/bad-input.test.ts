// Unreadable or unmeasurable captures: each is refused with a typed
// CaptureError whose code says why and whose message names the line.
import { describe, expect, it } from "vitest";
import { MAX_CAPTURE_BYTES, measureCsv } from "@/lib/capture";
import { byteChunks } from "./fixtures/synth";
import { captureRefusal } from "./capture-refusal";

const refusal = (source: Parameters<typeof measureCsv>[0], maxBytes?: number) =>
  captureRefusal(() => measureCsv(source, maxBytes === undefined ? {} : { maxBytes }));

/** A clean 0/5 V square wave, 10 samples per half period. */
function squareRows(n: number): string[] {
  return Array.from({ length: n }, (_, i) => `${i * 1e-6},${Math.floor(i / 10) % 2 ? 5 : 0}`);
}

describe("bad files", () => {
  it("empty file and blank lines only", async () => {
    let e = await refusal("");
    expect(e.code).toBe("empty");
    expect(e.message).toMatch(/^line 1: /);
    e = await refusal("\n  \n\n");
    expect(e.code).toBe("empty");
  });

  it("one column and no sample interval", async () => {
    const e = await refusal(["Reading (V)", "0.1", "0.2", "0.3"].join("\n"));
    expect(e.code).toBe("one-column");
    expect(e.line).toBe(2);
    expect(e.message).toMatch(/^line 2: .*sample interval/);
  });

  it("text only", async () => {
    const e = await refusal("Bench notes\nthe probe was loose\nno trace saved\n");
    expect(e.code).toBe("no-numeric-data");
    expect(e.line).toBe(3);
    expect(e.message).toMatch(/^line 3: /);
  });

  it("binary bytes", async () => {
    const head = new TextEncoder().encode("Time (s),CH1 (V)\n0,0\n");
    const bytes = new Uint8Array(head.length + 6);
    bytes.set(head);
    bytes.set([0x89, 0x00, 0x01, 0x02, 0x0a, 0x41], head.length);
    const e = await refusal(byteChunks(bytes, 5));
    expect(e.code).toBe("binary");
    expect(e.line).toBe(3);
    expect(e.message).toMatch(/^line 3: .*binary/);
  });

  it("time going backwards", async () => {
    const rows = ["Time (s),CH1 (V)", ...squareRows(40)];
    rows[30] = `${25e-6},5`; // line 31 is earlier than line 30 (28 us)
    const e = await refusal(rows.join("\n"));
    expect(e.code).toBe("non-monotonic-time");
    expect(e.line).toBe(31);
    expect(e.message).toMatch(/^line 31: .*line 30/);
  });

  it("time that never advances", async () => {
    const rows = ["Time (s),CH1 (V)", ...squareRows(40).map((r) => `0${r.slice(r.indexOf(","))}`)];
    const e = await refusal(rows.join("\n"));
    expect(e.code).toBe("non-monotonic-time");
  });

  it("NaN, text and empty values among the numbers", async () => {
    const rows = ["Time (s),CH1 (V)", ...squareRows(300)];
    rows[250] = `${249e-6},NaN`;
    let e = await refusal(rows.join("\n"));
    expect(e.code).toBe("not-a-number");
    expect(e.message).toMatch(/^line 251: "NaN" in column 2 \("CH1"\)/);
    rows[250] = `${249e-6},`;
    rows[100] = `${99e-6},overload`;
    e = await refusal(rows.join("\n"));
    expect(e.code).toBe("not-a-number");
    expect(e.line).toBe(101);
    // NaN in the rows used to find the format is still a bad value, not a header.
    const early = ["Time (s),CH1 (V)", ...squareRows(40)];
    early[3] = "2e-6,nan";
    e = await refusal(early.join("\n"));
    expect(e.code).toBe("not-a-number");
    expect(e.line).toBe(4);
  });

  it("rows with a missing or an extra value", async () => {
    const rows = ["Time (s),CH1 (V)", ...squareRows(300)];
    rows[220] = `${219e-6}`;
    let e = await refusal(rows.join("\n"));
    expect(e.code).toBe("column-count");
    expect(e.line).toBe(221);
    rows[220] = `${219e-6},0,7`;
    e = await refusal(rows.join("\n"));
    expect(e.code).toBe("column-count");
  });

  it("over the size limit, while streaming", async () => {
    expect(MAX_CAPTURE_BYTES).toBe(64 * 1024 * 1024);
    const text = ["Time (s),CH1 (V)", ...squareRows(500)].join("\n");
    const bytes = new TextEncoder().encode(text);
    let chunksRead = 0;
    async function* counted() {
      for await (const c of byteChunks(bytes, 256)) {
        chunksRead++;
        yield c;
      }
    }
    const e = await refusal(counted(), 2048);
    expect(e.code).toBe("too-large");
    expect(e.message).toMatch(/^line \d+: .*2 KiB limit/);
    // Stopped at the chunk that crossed the limit, not at the end of input.
    expect(chunksRead).toBe(9);
    expect((await refusal(text, 2048)).code).toBe("too-large");
  });

  it("a flat trace and a trace without two rising edges", async () => {
    const flat = ["Time (s),CH1 (V)", ...squareRows(50).map((r) => r.replace(/,\d+$/, ",1.2"))];
    expect((await refusal(flat.join("\n"))).code).toBe("flat");
    const oneStep = ["Time (s),CH1 (V)", ...squareRows(15)];
    const e = await refusal(oneStep.join("\n"));
    expect(e.code).toBe("no-period");
    expect(e.line).toBeNull();
  });
});
