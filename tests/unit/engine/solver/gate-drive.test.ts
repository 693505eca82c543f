// Gate-drive needs in the accuracy budget (engine.md section 6): a plan whose
// gate pulse is outside the minimum/maximum, or whose pulse train does not
// fit, "misses" whatever the clock does. Gate-pulse figures: a thyristor gate
// wants a pulse of some tens of microseconds, well beyond its gate-controlled
// turn-on time, and a pulse train for inductive loads (common practice, no
// source). Triggered plans are judged on the delay from the input edge.
import { describe, expect, it } from "vitest";
import { accuracyBudget, planTarget } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

// A 133 Hz firing stage with a 22 us gate pulse (the demo's free-running heater before section 6).
const pwm = planTarget({ device: "atmega328p", clockHz: 16e6, periodS: 7.52e-3, highS: 22e-6, mode: "pwm" });
const toggle = planTarget({
  device: "atmega328p",
  clockHz: 16e6,
  periodS: 7.52e-3,
  highS: 22e-6,
  mode: "toggle",
});
const gate = { minPulseS: 10e-6, maxPulseS: 100e-6 };

describe("gate pulse limits", () => {
  it("a 22 us pwm pulse meets 10..100 us", () => {
    const b = accuracyBudget(pwm, { toleranceRelative: 0.01, gateDrive: gate });
    expect(b.gate!.ok).toBe(true);
    expect(b.verdict).toBe("meets");
  });

  it("a toggle plan gives a 3.76 ms 'pulse': misses though the period meets", () => {
    const b = accuracyBudget(toggle, { toleranceRelative: 0.01, gateDrive: gate });
    expect(b.meetsTolerance).toBe(true);
    expect(b.gate!.pulseS).toBeCloseTo(3.76e-3, 9);
    expect(b.gate!.ok).toBe(false);
    expect(b.verdict).toBe("misses");
    expect(b.notes.join(" ")).toMatch(/longer than the gate's maximum/);
  });

  it("a pulse shorter than the minimum misses", () => {
    const b = accuracyBudget(pwm, { toleranceRelative: 0.01, gateDrive: { minPulseS: 50e-6 } });
    expect(b.verdict).toBe("misses");
  });

  it("without gate needs the verdict is the tolerance alone (free plans unchanged)", () => {
    const b = accuracyBudget(pwm, { toleranceRelative: 0.01 });
    expect(b.gate).toBeUndefined();
    expect(b.verdict).toBe(b.meetsTolerance ? "meets" : "misses");
    expect(b.basis).toBe("period");
  });
});

describe("pulse train", () => {
  const zc = planTarget({
    device: "atmega328p",
    clockHz: 16e6,
    start: "zero-cross",
    periodS: 0.01,
    delayS: 5e-3,
    highS: 20e-6,
  });
  it("10 pulses every 100 us after a 5 ms delay fit in the 10 ms half cycle", () => {
    const b = accuracyBudget(zc, {
      toleranceRelative: 0.01,
      gateDrive: { trainPeriodS: 100e-6, trainPulses: 10 },
    });
    expect(b.gate!.ok).toBe(true);
  });
  it("60 pulses every 100 us do not: misses", () => {
    const b = accuracyBudget(zc, {
      toleranceRelative: 0.01,
      gateDrive: { trainPeriodS: 100e-6, trainPulses: 60 },
    });
    expect(b.verdict).toBe("misses");
  });
  it("a pulse wider than the train period misses", () => {
    const b = accuracyBudget(zc, {
      toleranceRelative: 0.01,
      gateDrive: { trainPeriodS: 10e-6, trainPulses: 3 },
    });
    expect(b.gate!.ok).toBe(false);
  });
});

describe("triggered plans are judged on the delay", () => {
  it("basis delay; jitter = latency + one count over the delay", () => {
    const zc = planTarget({
      device: "atmega328p",
      clockHz: 16e6,
      start: "zero-cross",
      periodS: 0.01,
      delayS: 5e-3,
      highS: 1e-4,
    });
    const b = accuracyBudget(zc, { toleranceRelative: 0.001 });
    expect(b.basis).toBe("delay");
    expect(b.jitterPpm).toBeCloseTo(((zc.latencyS! + 8 / 16e6) / 5e-3) * 1e6, 6);
  });
});

describe("bad gate needs are refused, naming the field", () => {
  it("refusals", () => {
    expectEngineError(
      () => accuracyBudget(pwm, { toleranceRelative: 0.01, gateDrive: { minPulseS: -1 } }),
      "invalid-request",
      "gateDrive.minPulseS",
    );
    expectEngineError(
      () => accuracyBudget(pwm, { toleranceRelative: 0.01, gateDrive: { minPulseS: 2e-4, maxPulseS: 1e-4 } }),
      "invalid-request",
      "gateDrive.minPulseS",
    );
    expectEngineError(
      () => accuracyBudget(pwm, { toleranceRelative: 0.01, gateDrive: { trainPeriodS: 1e-4 } }),
      "invalid-request",
      "gateDrive.trainPulses",
    );
    const noPeriod = expectEngineError(
      () => accuracyBudget(pwm, { toleranceRelative: 0.01, gateDrive: { trainPulses: 3 } }),
      "invalid-request",
      "gateDrive.trainPeriodS",
    );
    expect(noPeriod.message).toBe(
      "A pulse train needs both gateDrive.trainPeriodS and gateDrive.trainPulses.",
    );
    expectEngineError(
      () =>
        accuracyBudget(pwm, { toleranceRelative: 0.01, gateDrive: { trainPeriodS: 1e-4, trainPulses: 2.5 } }),
      "invalid-request",
      "gateDrive.trainPulses",
    );
  });
});
