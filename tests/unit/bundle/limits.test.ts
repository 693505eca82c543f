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
    expect(p.source).toContain("required tolerance ±2 %");
  });

  it("the board's own spread is the floor when the requirement is tighter", () => {
    const p = checklistLimits(plan, null, { requiredRelative: 1e-6 }).find((l) => l.id === "period")!;
    expect(p.max - p.expected).toBeCloseTo(1.5e-6, 15);
    expect(p.source).toContain("plan: clock ±50 ppm");
  });

  it("instrument resolution widens the band by exactly its value", () => {
    const p = checklistLimits(plan, null, { requiredRelative: 0.02, resolutionS: 10e-6 }).find(
      (l) => l.id === "period",
    )!;
    expect(p.max - p.expected).toBeCloseTo(410e-6, 12);
    expect(p.source).toContain("instrument resolution 10.0 µs");
  });

  it("frequency and duty are marked derived", () => {
    const ls = checklistLimits(plan, null);
    expect(ls.filter((l) => l.derived).map((l) => l.id)).toEqual(["frequency", "duty"]);
  });
});

// Issue 18 point 1: the printed checklist names each limit's source and marks
// the derived lines as information (rule: common practice, no source).
describe("CHECKLIST.md says where each limit comes from", () => {
  const withTolerance = { ...TARGETS[0], requiredTolerancePct: 2 };
  const list = buildBundleSources(spec([withTolerance])).find((f) => f.path === "atmega328p/CHECKLIST.md")!
    .content as string;
  const rows = list
    .split("\n")
    .filter((l: string) => /^\| [BS]\d+ \| (Period|High time|Frequency|Duty cycle) /.test(l));

  it("prints the required tolerance as the period and high-time source", () => {
    const period = rows.filter((r) => r.includes("| Period at") || r.includes("| Period "));
    expect(period.length).toBe(2);
    for (const r of period) expect(r).toContain("limit from: required tolerance ±2 %");
  });

  it("marks frequency and duty as information, without a tick box", () => {
    const derived = rows.filter((r) => / \| (Frequency|Duty cycle) at/.test(r));
    expect(derived.length).toBe(4);
    for (const r of derived) {
      expect(r).toContain("derived from the measured period and high time");
      expect(r.trim().endsWith("| information |")).toBe(true);
    }
  });

  it("without a requirement the plan is named as the source", () => {
    const plain = buildBundleSources(spec([TARGETS[0]])).find(
      (f) => f.path === "atmega328p/CHECKLIST.md",
    )!.content;
    expect(plain).toContain("limit from: plan: clock ±50 ppm + jitter + one timer count");
  });
});
