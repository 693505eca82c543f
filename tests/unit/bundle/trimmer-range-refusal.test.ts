// A kept trimmer whose long end the target's timer cannot hold is refused with
// the bundle's own words: which target, the trimmer's longest period, the
// register that overflows and what to do (lib/bundle/trim-control.ts, the
// product's message; DEVELOPERS.md: "a range the timer set-up cannot hold is
// refused naming targets.<i>"). Everything runs inside `it`, so a refusal
// from a fault fails a test instead of the file's loading.
// Sources for the numbers: NE555 astable period T = ln 2 * (RA + 2 RB) * C
// (TI NE555 datasheet SLFS022, astable operation: f = 1.44 / ((RA + 2 RB) C));
// ATtiny85 Timer0 fast PWM mode 7 has TOP = OCR0A, an 8-bit register, period
// (1 + OCR0A) counts of clk/N with N in 1, 8, 64, 256, 1024 (ATtiny25/45/85
// datasheet, Timer/Counter0, clock select table).
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleSpec } from "@/lib/bundle";
import { eng } from "@/lib/bundle/format";
import { expectEngineError } from "../engine/expect-engine-error";
import { GOLDEN_CASES } from "../../golden/cases";

const golden = (): BundleSpec => GOLDEN_CASES.find((c) => c.name === "kept-trimmer-555")!.spec;
// target 2 of the case: ATtiny85 at 8 MHz, Timer0 pwm, 1.4556 ms stored
const ATTINY = 1;

describe("a trimmer range Timer0 cannot hold", () => {
  it("is refused naming the target, the longest period, OCR0A's overflow and the remedy", () => {
    const spec = golden();
    const stage = spec.stage as { ra: number; c: number };
    // the stored build's own Timer0 divider (the solver's choice for 1.4556 ms)
    const stored = JSON.parse(
      String(buildBundleSources(spec).find((f) => f.path === "plan.json")?.content),
    ) as { targets: { plan: { divider: number } }[] };
    const n = stored.targets[ATTINY].plan.divider;
    expect([1, 8, 64, 256, 1024]).toContain(n);

    // trimmer 8.2 k + 20 k track: RB at the long end is 28.2 kΩ
    const seriesR = 8.2e3;
    const trackR = 20e3;
    const longestS = Math.LN2 * (stage.ra + 2 * (seriesR + trackR)) * stage.c;
    const ocr0a = Math.round((longestS * 8e6) / n) - 1;
    expect(ocr0a).toBeGreaterThan(255); // the case is built to overflow the 8-bit OCR0A

    const err = expectEngineError(
      () => buildBundleSources({ ...spec, control: { kind: "trimmer", field: "rb", seriesR, trackR } }),
      "invalid-request",
    );
    expect(err.field).toBe(`targets.${ATTINY}`);
    expect(err.message).toBe(
      `target ${ATTINY + 1} (attiny85) cannot keep the trimmer: ` +
        `the trimmer's longest period (${eng(longestS, "s")}) does not fit this timer set-up ` +
        `(attiny85: OCR0A = ${ocr0a} is outside 1..255 (timer TIMER0, mode pwm)); ` +
        "store rb at the trimmer's long end, or choose a lower clock.",
    );
  });
});
