// The tie order between hardware plans of equal period error (engine.md
// section 3: ties -> most counts per period, then smallest divider; the last
// key, a smaller mode factor, is the order documented at betterHardware in
// lib/engine/solver/hardware.ts: common practice, no source).
import { describe, expect, it } from "vitest";
import { DEVICES, type TimerSpec } from "@/lib/engine/devices";
import { bruteForceBestPeriod } from "@/lib/engine/solver";
import { bestHardware, betterHardware, type HardwareChoice } from "@/lib/engine/solver/hardware";

const choice = (divider: number, periodCounts: number, modeFactor: 1 | 2): HardwareChoice => ({
  divider,
  periodCounts,
  modeFactor,
  errorQuanta: 3,
  inRange: true,
});

describe("hardware plans of equal error", () => {
  it("prefer the smallest divider at equal counts (engine.md section 3)", () => {
    expect(betterHardware(choice(8, 100, 1), choice(64, 100, 1))).toBe(true);
    expect(betterHardware(choice(64, 100, 1), choice(8, 100, 1))).toBe(false);
  });

  it("prefer the smaller mode factor at equal counts and divider (hardware.ts ordering)", () => {
    // an edge-aligned count (factor 1) against an up-down or toggle count (factor 2)
    expect(betterHardware(choice(8, 100, 1), choice(8, 100, 2))).toBe(true);
    expect(betterHardware(choice(8, 100, 2), choice(8, 100, 1))).toBe(false);
  });
});

describe("a tie across the two counting modes of one timer", () => {
  // RP2040 PWM slice (RP2040 datasheet, section 4.5 PWM: period =
  // (TOP + 1) x (CSR_PH_CORRECT + 1) x (DIV_INT + DIV_FRAC / 16) system
  // clocks). 200 000 clocks are 50 000 counts of /4 edge-aligned and also
  // 50 000 counts of /2 phase-correct, both exact; at equal error and counts
  // the smaller divider wins (engine.md section 3), though the edge-aligned
  // pass finds its plan first. A search that stops the phase-correct pass as
  // soon as a divider can reach no more counts than the best keeps /4.
  const slice = DEVICES.find((d) => d.id === "rp2040")!.timers.find((t) => t.name === "PWM0")!;

  it("picks /2 phase-correct over /4 edge-aligned at 50 000 counts", () => {
    const best = bestHardware(slice, "pwm", 200_000 * slice.dividerQuantum)!;
    expect([best.divider, best.periodCounts, best.modeFactor, best.errorQuanta]).toEqual([2, 50_000, 2, 0]);
  });

  it("agrees with the exhaustive enumeration over the same dividers", () => {
    const few: TimerSpec = { ...slice, dividers: [1, 1.5625, 2, 3.125, 4, 4.0625] };
    const fast = bestHardware(few, "pwm", 200_000 * few.dividerQuantum)!;
    const slow = bruteForceBestPeriod(few, "pwm", 125e6, 200_000 / 125e6)!;
    expect([fast.divider, fast.periodCounts, fast.modeFactor]).toEqual([
      slow.divider,
      slow.periodCounts,
      slow.modeFactor,
    ]);
    expect(slow.divider).toBe(2);
  });
});
