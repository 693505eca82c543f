// The shared zod schemas read values the way the trade writes them. No server
// needed: these are the exact schemas the forms and the API use.
import { describe, expect, it } from "vitest";
import { etagMatches } from "@/lib/revisions/bundle-http";
import { readTolerance, stageSchema, stageToForm, targetSchema } from "@/lib/validation";

describe("stage values in engineering notation", () => {
  it("reads IEC 60062 letter-as-decimal-point codes and SI prefixes", () => {
    const s = stageSchema.parse({
      kind: "timer555-astable",
      supplyV: "12 V",
      ra: "4k7",
      rb: "R47",
      c: "2u2",
    });
    // IEC 60062: the letter stands for the decimal point and the multiplier (4k7 = 4.7 kΩ, R47 = 0.47 Ω).
    expect(s).toMatchObject({ ra: 4700, rb: 0.47, c: 2.2e-6, supplyV: 12 });
  });

  it("round-trips a stored stage through the form text", () => {
    const stored = stageSchema.parse({
      kind: "ujt",
      supplyV: 20,
      timingR: 33e3,
      timingC: 220e-9,
      eta: 0.65,
      tolerances: { timingC: [0.2, 0.8] },
    });
    expect(stageSchema.parse(stageToForm(stored))).toEqual(stored);
  });

  it("puts each refusal on its field", () => {
    const r = stageSchema.safeParse({
      kind: "ujt",
      supplyV: "20",
      timingR: "4,7k",
      timingC: "0",
      eta: "0.65",
    });
    expect(r.success).toBe(false);
    const paths = r.error!.issues.map((i) => i.path.join("."));
    expect(paths).toEqual(expect.arrayContaining(["timingR", "timingC"]));
  });
});

describe("tolerances", () => {
  it("reads percent, symmetric and asymmetric", () => {
    expect(readTolerance("5")).toEqual({ ok: true, value: 0.05 });
    expect(readTolerance("±10 %")).toEqual({ ok: true, value: 0.1 });
    // IEC 60062 tolerance letter Z is -20/+80 %, the usual electrolytic capacitor range.
    expect(readTolerance("-20/+80")).toEqual({ ok: true, value: [0.2, 0.8] });
    expect(readTolerance("lots").ok).toBe(false);
  });
});

describe("targets", () => {
  it("refuses a clock the device cannot run at, naming the range", () => {
    const r = targetSchema.safeParse({ device: "attiny85", clockSource: "crystal", clockHz: "25M" });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].path).toEqual(["clockHz"]);
  });
  it("accepts the STM32G031 HSI16 at 16 MHz (RM0444, HSI16 clock)", () => {
    expect(targetSchema.parse({ device: "stm32g031", clockSource: "hsi16", clockHz: "16M" }).clockHz).toBe(
      16e6,
    );
  });
});

describe("If-None-Match (RFC 9110 section 13.1.2)", () => {
  const sha = "a".repeat(64);
  it("matches strong, weak, listed and * tags", () => {
    expect(etagMatches(`"${sha}"`, sha)).toBe(true);
    expect(etagMatches(`W/"${sha}"`, sha)).toBe(true);
    expect(etagMatches(`"x", "${sha}"`, sha)).toBe(true);
    expect(etagMatches("*", sha)).toBe(true);
    expect(etagMatches(`"${"b".repeat(64)}"`, sha)).toBe(false);
    expect(etagMatches(null, sha)).toBe(false);
  });
});
