// Issue 18 point 4: numbers people can read, and messages in the form's words.
// Sources: SI Brochure, 9th edition (BIPM 2019), 5.4.7: prefixes are not
// attached to the number one, so a dimensionless ratio reads 0.65, not "650m"
// (from memory); engineering notation with SI prefixes per IEC 60062 / the SI
// Brochure 3 (prefixes). Where ppm stops being readable (10 000 ppm = 1 %) and
// the thousands-separator rule are common practice, no source.
import { describe, expect, it } from "vitest";
import { ppm as bundlePpm } from "@/lib/bundle/format";
import { formatValue } from "@/lib/diff/numbers";
import { formatPpm, formatRatio, parseEng } from "@/lib/engine";
import { defaultText, echoText } from "@/lib/validation/form-text";
import { plainMessage } from "@/lib/validation/plain-message";
import { stageSchema } from "@/lib/validation/stage";

describe("ppm past a sensible range", () => {
  it("keeps small errors in ppm", () => {
    expect(formatPpm(130)).toBe("130 ppm");
    expect(formatPpm(-12.5, 4)).toBe("-12.5 ppm");
  });
  it("switches to percent from 10 000 ppm and to a ratio from 100 %", () => {
    expect(formatPpm(20000)).toBe("2 %");
    expect(formatPpm(14319198.822, 3, true)).toBe("15.3 × the target");
    expect(formatPpm(1030000)).toBe("2.03 × the target");
    expect(bundlePpm(14319198.822)).toBe("15.32 × the target");
    expect(bundlePpm(25000)).toBe("+2.500 %");
    expect(bundlePpm(1.5)).toBe("+1.500 ppm");
  });
});

describe("ratios and seconds", () => {
  it("a ratio is a plain decimal", () => {
    expect(formatRatio(0.65)).toBe("0.65");
    expect(formatValue({ value: 0.65, unit: "", fmt: "eng" })).toBe("0.65");
  });
  it("bare seconds in a message read in engineering units", () => {
    expect(plainMessage("High time 0.00001671 s is too short")).toBe("High time 16.71 µs is too short");
    expect(plainMessage("a pulse of 5e-7 s")).toBe("a pulse of 500 ns");
  });
});

describe("messages name the label, not the field", () => {
  it("engine field names become the form's labels", () => {
    const m = plainMessage("peakV (12 V) must be above valleyV (14 V).", "threshold");
    expect(m).not.toMatch(/peakV|valleyV/);
    expect(m).toContain("(12 V)");
  });
  it("a stage the engine refuses gets a message without internal names", () => {
    const r = stageSchema.safeParse({
      kind: "threshold",
      supplyV: "12",
      timingR: "10k",
      timingC: "100n",
      dischargeR: "100",
      peakV: "4",
      valleyV: "8",
      tolerances: {},
    });
    expect(r.success).toBe(false);
    for (const i of r.error!.issues) expect(i.message).not.toMatch(/\b(peakV|valleyV|highS|tolerances\.)/);
  });
});

describe("thousands separators", () => {
  it("reads 16,000,000 and 1,500.5, refuses the ambiguous 1,500 and 1,5", () => {
    expect(parseEng("16,000,000", "Hz")).toBe(16e6);
    expect(parseEng("16,000,000 Hz", "Hz")).toBe(16e6);
    expect(parseEng("1,500.5")).toBe(1500.5);
    expect(() => parseEng("1,500")).toThrow(/thousands separator or a decimal comma/);
    expect(() => parseEng("1,5")).toThrow(/decimal separator/);
  });
});

describe("inputs echo what they read", () => {
  it("1m5 reads as 1.5 mΩ; 16,000,000 as 16 MHz; a ratio as a decimal", () => {
    expect(echoText("1m5", "Ω")).toBe("1.5 mΩ");
    expect(echoText("16,000,000", "Hz")).toBe("16 MHz");
    expect(echoText("0.65", "")).toBe("0.65");
    expect(echoText("", "Ω")).toBeNull();
    expect(echoText("4k7x", "Ω")).toBeNull();
  });
  it("defaults are written in units", () => {
    expect(defaultText(5e-6, "s")).toBe("default 5 µs");
    expect(defaultText(0.65, "")).toBe("default 0.65");
  });
});
