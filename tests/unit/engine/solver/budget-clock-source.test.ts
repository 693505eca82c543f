// The budget says where its clock figure comes from (each option's basis:
// tests/unit/engine/devices/clock-accuracy-basis.test.ts), so an engineer can
// tell a datasheet limit from an assumption before trusting the verdict.
import { describe, expect, it } from "vitest";
import { accuracyBudget, planTarget } from "@/lib/engine";

describe("the budget's clock note", () => {
  it("ATmega328P crystal: 50 ppm, common practice (no datasheet gives a crystal's tolerance)", () => {
    const p = planTarget({ device: "atmega328p", clockHz: 16e6, periodS: 1e-3, highS: 0.25e-3 });
    const b = accuracyBudget(p, { toleranceRelative: 0.01 });
    expect(b.notes).toContain("Clock figure 50 ppm (Crystal 1-20 MHz): common practice.");
    expect(b.clockOptions.find((c) => c.id === "rc8m")!.accuracySource).toBe("datasheet, from memory");
  });

  it("each clock option's verdict: its figure plus the plan's quantization and jitter, against the requirement", () => {
    // 16 MHz, 1 ms = 16 000 cycles exactly: quantization and jitter 0, so each option's total is its
    // own figure. ATmega328P datasheet (DS40002061), calibrated internal RC oscillator accuracy:
    // factory calibration +-10 %, user calibration +-1 % (from memory); crystal and external clock
    // 50 ppm (common practice, no source). Against 1 %: the user-calibrated RC sits exactly on the
    // limit and passes, the factory-calibrated 8 MHz and the 128 kHz oscillator do not.
    const p = planTarget({ device: "atmega328p", clockHz: 16e6, periodS: 1e-3, highS: 0.25e-3 });
    const b = accuracyBudget(p, { toleranceRelative: 0.01 });
    expect(b.clockOptions.map((c) => [c.id, c.totalPpm, c.ok])).toEqual([
      ["crystal", 50, true],
      ["rc8m", 100000, false],
      ["rc8m-cal", 10000, true],
      ["rc128k", 100000, false],
      ["external", 50, true],
    ]);
    expect(b.internalOscillatorOk).toBe(true);
    const tight = accuracyBudget(p, { toleranceRelative: 0.005 });
    expect(tight.clockOptions.filter((c) => c.ok).map((c) => c.id)).toEqual(["crystal", "external"]);
    expect(tight.internalOscillatorOk).toBe(false);
  });

  it("a figure past 1e4 ppm reads in percent, as every ppm figure the product shows", () => {
    // The product's own rule for ppm figures (formatPpm in lib/engine/units.ts, checked on the
    // page by tests/browser/numbers-wording.test.ts): from 1e4 ppm on, a percentage.
    const p = planTarget({
      device: "attiny85",
      clockHz: 128e3,
      periodS: 1,
      highS: 0.25,
      clockSource: "rc128k",
    });
    const b = accuracyBudget(p, { toleranceRelative: 0.01 });
    expect(b.notes).toContain("Clock figure 10 % (Internal 128 kHz oscillator): from memory.");
  });

  it("the verdict and spread notes read in percent past 1e4 ppm too", () => {
    // 8 MHz RC: 1 ms = 8000 cycles exactly, so quantization and jitter are 0; the clock's
    // 100000 ppm and a 20 % old-stage spread are shown as 10 % and 20 %.
    const p = planTarget({
      device: "atmega328p",
      clockHz: 8e6,
      periodS: 1e-3,
      highS: 0.25e-3,
      clockSource: "rc8m",
    });
    const b = accuracyBudget(p, { toleranceRelative: 0.01, stageSpreadRelative: 0.2 });
    expect(b.notes[0]).toBe(
      "Misses the required 1 %: clock 10 % + quantization 0 ppm + jitter 0 ppm = 10 %; clock dominates.",
    );
    expect(b.notes).toContain("The old stage's spread (20 %) is larger than the new budget.");
    for (const n of b.notes) expect(n).not.toMatch(/\d{5,} ppm/);
  });

  it("a figure entered by the user says so and keeps the option's own figure beside it", () => {
    const p = planTarget({
      device: "atmega328p",
      clockHz: 8e6,
      periodS: 1e-3,
      highS: 0.25e-3,
      clockSource: "rc8m-cal",
      clockAccuracyPpm: 2000,
    });
    const b = accuracyBudget(p, { toleranceRelative: 0.01 });
    expect(b.clockPpm).toBe(2000);
    expect(b.notes).toContain(
      "Clock figure 2000 ppm as entered; Internal RC 8 MHz, user calibrated is listed at 1 % (datasheet, from memory).",
    );
  });
});
