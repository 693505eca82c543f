// Checklist pass limits: achieved value ± (clock accuracy × value + jitter +
// one timer count). The rule is ours (common practice, no source); the inputs
// come from the plan: ATmega328P at 16 MHz, prescaler 8 -> one count = 0.5 us
// (ATmega328P datasheet, Timer1 clock select), crystal ±50 ppm as the plan says.
import { describe, expect, it } from "vitest";
import { buildBundleSources, checklistLimits, withinLimit, type BundlePlan } from "@/lib/bundle";
import { eng } from "@/lib/bundle/format";
import { planTarget } from "@/lib/engine";
import { TARGETS, spec } from "./fixtures";

describe("checklist limits", () => {
  const plan = planTarget(TARGETS[0]) as BundlePlan;
  const limits = checklistLimits(plan, null);
  const period = limits.find((l) => l.id === "period")!;

  it("period band for 20 ms at ±50 ppm with a 0.5 us count is ±1.5 us", () => {
    expect(plan.divider).toBe(8);
    expect(plan.clockAccuracyPpm).toBe(50);
    expect(period.expected).toBe(0.02);
    expect(period.max - period.expected).toBeCloseTo(20e-3 * 50e-6 + 0.5e-6, 15);
    expect(period.expected - period.min).toBeCloseTo(1.5e-6, 15);
  });

  it("judges measurements at and beyond the edges", () => {
    expect(withinLimit(period, period.max)).toBe(true);
    expect(withinLimit(period, period.max + 1e-9)).toBe(false);
    expect(withinLimit(period, Number.NaN)).toBe(false);
  });

  it("an interrupt plan widens the band by its reported jitter", () => {
    const isr = planTarget(TARGETS[1]) as BundlePlan;
    const p = checklistLimits(isr, null).find((l) => l.id === "period")!;
    expect(isr.jitterS).toBeGreaterThan(0);
    expect(p.max - p.expected).toBeCloseTo(
      isr.periodS * 50e-6 + isr.jitterS! + isr.divider / isr.clockHz,
      15,
    );
  });

  it("the printed checklist shows the same limits", () => {
    const list = buildBundleSources(spec([TARGETS[0]])).find(
      (f) => f.path === "atmega328p/CHECKLIST.md",
    )!.content;
    expect(list).toContain(`${eng(period.min, "s")} … ${eng(period.max, "s")}`);
  });
});

// Issue 18 point 1: limits from the required tolerance and the instrument.
// The rule (required tolerance as the promise, board spread as the floor,
// plus reading resolution) is ours: common practice, no source. Duty =
// pulse duration / period per IEEE Std 181-2011, so frequency and duty follow
// from the two measured times and are not judged on their own.
describe("limits from the required tolerance and the instrument", () => {
  const plan = planTarget(TARGETS[0]) as BundlePlan;

  it("a 2 % requirement gives ±2 % of the achieved 20 ms period (±400 us)", () => {
    const p = checklistLimits(plan, null, { requiredRelative: 0.02 }).find((l) => l.id === "period")!;
    expect(p.max - p.expected).toBeCloseTo(400e-6, 12);
    expect(p.source).toContain("required ±2 %");
  });

  it("the board's own spread is the floor when the requirement is tighter", () => {
    const p = checklistLimits(plan, null, { requiredRelative: 1e-6 }).find((l) => l.id === "period")!;
    expect(p.max - p.expected).toBeCloseTo(1.5e-6, 15);
    expect(p.source).toContain("board spread");
  });

  it("instrument resolution widens the band by exactly its value", () => {
    const p = checklistLimits(plan, null, { requiredRelative: 0.02, resolutionS: 10e-6 }).find(
      (l) => l.id === "period",
    )!;
    expect(p.max - p.expected).toBeCloseTo(410e-6, 12);
    expect(p.source).toContain("instrument resolution");
  });

  it("frequency and duty are marked derived", () => {
    const ls = checklistLimits(plan, null);
    expect(ls.filter((l) => l.derived).map((l) => l.id)).toEqual(["frequency", "duty"]);
  });
});
