import { describe, expect, it } from "vitest";
import { accuracyBudget, planTarget, suggestCrystals } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

describe("accuracy budget", () => {
  it("internal RC (+-10 % factory, ATmega328P datasheet, from memory) misses 1 %; a crystal meets it", () => {
    const p = planTarget({
      device: "atmega328p",
      clockHz: 8e6,
      periodS: 1e-3,
      highS: 0.25e-3,
      clockSource: "rc8m",
    });
    const b = accuracyBudget(p, { toleranceRelative: 0.01, stageSpreadRelative: 0.2 });
    expect(b.clockPpm).toBe(100000);
    expect(b.dominant).toBe("clock");
    expect(b.meetsTolerance).toBe(false);
    expect(b.clockOptions.find((c) => c.id === "crystal")!.ok).toBe(true);
    expect(b.clockOptions.find((c) => c.id === "rc8m-cal")!.ok).toBe(true); // user-calibrated +-1 % (from memory)
    expect(b.internalOscillatorOk).toBe(true);
    expect(b.improvement).toBeCloseTo(200000 / 100000, 12);
  });

  it("quantization dominates when the period is not a whole number of clocks", () => {
    // 145.6 us at 16 MHz = 2329.6 cycles: the nearest, 2330, is 171.7 ppm long
    const p = planTarget({ device: "atmega328p", clockHz: 16e6, periodS: 145.6e-6, highS: 76.2e-6 });
    const b = accuracyBudget(p, { toleranceRelative: 1e-4 });
    expect(b.quantizationPpm).toBeCloseTo((0.4 / 2329.6) * 1e6, 6);
    expect(b.dominant).toBe("quantization");
    expect(b.meetsTolerance).toBe(false);
    expect(b.totalPpm).toBeCloseTo(50 + b.quantizationPpm, 9);
  });
  it("takes a tolerance and a stage spread of 0 and refuses negative ones, naming the field", () => {
    // A tolerance or a spread is a half-width, so 0 is the least it can be and
    // a negative one means nothing; the refusal is the product's own message.
    const p = planTarget({ device: "atmega328p", clockHz: 16e6, periodS: 1e-3, highS: 0.25e-3 });
    const b = accuracyBudget(p, { toleranceRelative: 0, stageSpreadRelative: 0 });
    expect(b.requiredPpm).toBe(0);
    for (const [field, input] of [
      ["toleranceRelative", { toleranceRelative: -0.01 }],
      ["stageSpreadRelative", { toleranceRelative: 0.01, stageSpreadRelative: -0.01 }],
    ] as const) {
      const err = expectEngineError(() => accuracyBudget(p, input), "invalid-request", field);
      expect(err.message).toBe(`${field} must be a finite number >= 0.`);
    }
  });
});

describe("crystal suggestion", () => {
  it("115200-style UART crystals make a 1/115200 s period exact on the ATmega328P", () => {
    // 1.8432, 3.6864, 7.3728, 11.0592, 14.7456, 18.432 MHz are multiples of 115200 Hz (x16, 32, 64, 96, 128, 160)
    const s = suggestCrystals({ device: "atmega328p", periodS: 1 / 115200, highS: 0.5 / 115200 });
    const exact = s.filter((x) => x.exact).map((x) => x.clockHz);
    expect(exact).toEqual(
      expect.arrayContaining([1.8432e6, 3.6864e6, 7.3728e6, 11.0592e6, 14.7456e6, 18.432e6]),
    );
    expect(exact).not.toContain(16e6); // 16e6 / 115200 = 138.9
    expect(s[0].exact).toBe(true);
    expect(s.every((x) => x.clockHz <= 20e6)).toBe(true);
  });

  it("a 32.768 kHz watch crystal (2^15 Hz) makes 1 s exact on the MSP430G2553's LFXT1", () => {
    // 32768 = 2^15 Hz is the watch-crystal frequency; LFXT1 in low-frequency
    // mode takes a 32768 Hz watch crystal (MSP430x2xx family user's guide
    // SLAU144, basic clock module+; from memory). Timer_A is 16 bits, so 1 s
    // at /1 is 32768 counts, and the faster crystals are refused by LFXT1.
    const s = suggestCrystals({ device: "msp430g2553", periodS: 1, highS: 0.5 });
    expect(s.map((x) => x.clockHz)).toEqual([32768]);
    expect(s[0]).toMatchObject({ exact: true, divider: 1, periodCounts: 32768, softwareDivider: 1 });
  });
});
