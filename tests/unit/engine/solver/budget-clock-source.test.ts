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
      "Clock figure 2000 ppm as entered; Internal RC 8 MHz, user calibrated is listed at 10000 ppm (datasheet, from memory).",
    );
  });
});
