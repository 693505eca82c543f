// The tie order between hardware plans of equal period error (engine.md
// section 3: ties -> most counts per period, then smallest divider; the last
// key, a smaller mode factor, is the order documented at betterHardware in
// lib/engine/solver/hardware.ts: common practice, no source).
import { describe, expect, it } from "vitest";
import { betterHardware, type HardwareChoice } from "@/lib/engine/solver/hardware";

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
