// Target form helper: wanted power fraction or firing angle -> delay after the
// zero crossing. Reference: full-wave AC voltage controller with a resistive
// load, Vo,rms/Vs = sqrt(1 - a/pi + sin(2a)/(2 pi)) (Mohan, Undeland, Robbins,
// Power Electronics, AC voltage controllers; engine.md section 6). At a = 90
// degrees the formula gives exactly 1/2 of the power (sin(2a) = 0), and the
// delay of an angle is angle/180 of the half cycle (10 ms at 50 Hz).
import { describe, expect, it } from "vitest";
import { firingDelayFrom } from "@/lib/validation/firing-delay";

describe("firing delay from power fraction or angle", () => {
  it("50 % power at 50 Hz is a 90 degree angle, 5 ms after the crossing", () => {
    const r = firingDelayFrom("power", "50", "50");
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.angleDeg).toBeCloseTo(90, 6);
    expect(r.delayS).toBeCloseTo(5e-3, 9);
  });

  it("60 degrees at 60 Hz: delay 1/3 of 8.333 ms, power 1 - 1/3 + sin(120 deg)/(2 pi)", () => {
    const r = firingDelayFrom("angle", "60", "60");
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.delayS).toBeCloseTo(1 / 360, 9);
    expect(r.powerFraction).toBeCloseTo(1 - 1 / 3 + Math.sin((2 * Math.PI) / 3) / (2 * Math.PI), 9);
  });

  it("power and angle read each other back", () => {
    const a = firingDelayFrom("power", "41", "50");
    expect(a.ok).toBe(true);
    if (!a.ok) return;
    const b = firingDelayFrom("angle", String(a.angleDeg), "50");
    expect(b.ok && b.powerFraction).toBeCloseTo(0.41, 6);
  });

  it.each([
    ["power", "0", "50", "power"],
    ["power", "120", "50", "power"],
    ["angle", "180", "50", "angle"],
    ["angle", "x", "50", "angle"],
    ["power", "50", "", "mainsHz"],
  ] as const)("refuses %s %s with mains %s, naming %s", (from, v, hz, field) => {
    const r = firingDelayFrom(from, v, hz);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.field).toBe(field);
  });
});
