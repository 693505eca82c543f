// A refusal no single line is at fault for (errors.ts: line null "when no single
// line is at fault"; a flat trace, measure.ts) has a message without a "line N: "
// prefix: the product's own text.
import { describe, expect, it } from "vitest";
import { measureCsv } from "@/lib/capture";
import { captureRefusal } from "./capture-refusal";

describe("whole-file refusals", () => {
  it("a flat 1.2 V trace: code flat, no line, the message names the level only", async () => {
    // Our own demo trace: 50 samples 1 us apart, all at 1.2 V.
    const rows = ["Time (s),CH1 (V)", ...Array.from({ length: 50 }, (_, i) => `${i * 1e-6},1.2`)];
    const e = await captureRefusal(() => measureCsv(rows.join("\n"), {}));
    expect(e.code).toBe("flat");
    expect(e.line).toBeNull();
    expect(e.message).toBe("the trace stays at 1.2 V: no transitions to measure");
  });
});
