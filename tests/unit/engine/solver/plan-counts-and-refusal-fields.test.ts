// Plan numbers and a refusal field a fresh mutation sample (seed 67) showed no
// test holding: a triggered plan's counter steps and pulse error, the counts of
// a long RP2040 interrupt plan, and the field named when device is no string.
import { describe, expect, it } from "vitest";
import { planTarget } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

describe("a triggered plan's counter steps and pulse error", () => {
  // ATmega328P datasheet, 16-bit Timer/Counter1, TCCR1B clock select: clk/1
  // would need 16e6 * 5.1003e-3 = 81 605 counts, more than 65 536, so clk/8
  // (CS12:0 = 010): delay 5 ms = 10 000 counts of 0.5 us; pulse 100.3 us =
  // 200.6 counts, nearest 201 (engine.md section 3: nearest legal value).
  const p = planTarget({
    device: "atmega328p",
    clockHz: 16e6,
    start: "zero-cross",
    periodS: 0.01,
    delayS: 5e-3,
    highS: 100.3e-6,
  });

  it("counts delay plus pulse in one run", () => {
    // engine.md section 4: periodCounts = counter steps per hardware period;
    // a one-shot run counts the delay, then the pulse (engine.md section 6),
    // and the off edge is the compare at delay + pulse (OCR1A = 10 200).
    expect(p.divider).toBe(8);
    expect(p.delayCounts).toBe(10000);
    expect(p.highCounts).toBe(201);
    expect(p.periodCounts).toBe(10201);
    expect(p.registers.OCR1A).toBe(p.periodCounts - 1);
  });

  it("reports the pulse's own error in ppm", () => {
    // engine.md section 4: highErrorPpm is the achieved high time's error:
    // (201 * 0.5 us - 100.3 us) / 100.3 us * 1e6 = 0.2 / 100.3 * 1e6 = 1994.02 ppm.
    expect(p.highS).toBeCloseTo(100.5e-6, 15);
    expect(p.highErrorPpm).toBeCloseTo((0.2 / 100.3) * 1e6, 3);
  });
});

describe("a long RP2040 interrupt plan keeps its counts in the 16-bit counter", () => {
  // RP2040 datasheet, PWM chapter: TOP is 16 bits (at most 65 536 counts per
  // wrap) and DIV_INT is 1..255. 1 s at 125 MHz needs a software divider;
  // 125e6 = 2^6 * 5^9 factors exactly, so the period error is 0 (engine.md
  // section 3: least period error first).
  const p = planTarget({ device: "rp2040", clockHz: 125e6, periodS: 1, highS: 0.5, mode: "isr" });

  it("divider, counts and TOP within the hardware", () => {
    expect(p.mode).toBe("isr");
    expect(p.divider).toBeGreaterThanOrEqual(1);
    expect(p.divider).toBeLessThanOrEqual(255);
    expect(p.periodCounts).toBeLessThanOrEqual(65536);
    expect(p.registers.TOP).toBe(p.periodCounts - 1);
    expect(p.divider * p.periodCounts * p.softwareDivider).toBe(125e6);
    expect(p.periodErrorPpm).toBe(0);
  });
});

describe("a delay and pulse that end exactly at the next input edge", () => {
  // engine.md section 6: periodS is the shortest time between input edges;
  // the delay plus the pulse must end before the next edge (the refusal's
  // own words). 0.25 s + 0.25 s = 0.5 s exactly in binary floating point.
  it("is refused naming delayS", () => {
    const err = expectEngineError(
      () =>
        planTarget({
          device: "atmega328p",
          clockHz: 16e6,
          start: "trigger",
          periodS: 0.5,
          delayS: 0.25,
          highS: 0.25,
        }),
      "invalid-request",
      "delayS",
    );
    expect(err.message).toContain("must end before the next input edge");
  });
});

describe("a device that is not a string", () => {
  // lib/engine/solver/validate.ts, checkRequest: the refusal names the field
  // "device" (engine.md section 4: a typed error with a clear message).
  it("is refused naming device", () => {
    const err = expectEngineError(
      () => planTarget({ device: 42 as unknown as string, clockHz: 16e6, periodS: 1e-3, highS: 5e-4 }),
      "invalid-request",
      "device",
    );
    expect(err.message).toBe("device must be a device id string.");
  });
});
