// Refusals are typed EngineErrors with the offending field, never a plan.
import { describe, expect, it } from "vitest";
import { EngineError, planTarget, type PlanRequest } from "@/lib/engine";

const ok: PlanRequest = { device: "atmega328p", clockHz: 16e6, periodS: 1e-3, highS: 0.25e-3, mode: "pwm" };

function refuse(patch: Partial<Record<keyof PlanRequest, unknown>>, code: string, field?: string) {
  let err: unknown;
  try {
    planTarget({ ...ok, ...patch } as PlanRequest);
  } catch (e) {
    err = e;
  }
  expect(err).toBeInstanceOf(EngineError);
  expect((err as EngineError).code).toBe(code);
  if (field) expect((err as EngineError).field).toBe(field);
  return err as EngineError;
}

describe("bad plan requests", () => {
  it("no request object at all is refused in words, not a type error", () => {
    // A caller passing null, a number or a bare string gets the engine's own refusal, not a crash.
    for (const body of [null, undefined, 42, "atmega328p"]) {
      let err: unknown;
      try {
        planTarget(body as unknown as PlanRequest);
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(EngineError);
      expect((err as EngineError).code).toBe("invalid-request");
      expect((err as EngineError).message).toBe("A plan request object is required.");
    }
  });

  it("unknown device and timer name the known ones", () => {
    expect(refuse({ device: "atmega8" }, "unknown-device", "device").message).toContain("attiny85");
    expect(refuse({ timer: "TIM2" }, "unknown-timer", "timer").message).toContain("TIMER1");
  });

  it("clock outside the part's range (ATmega328P: 20 MHz maximum, datasheet speed grades)", () => {
    refuse({ clockHz: 24e6 }, "clock-out-of-range", "clockHz");
    refuse({ device: "msp430g2553", clockHz: 25e6 }, "clock-out-of-range", "clockHz");
  });

  it("an unknown clock source lists the device's options", () => {
    const msg = refuse({ clockSource: "quartz" }, "invalid-request", "clockSource").message;
    for (const id of ["crystal", "rc8m", "rc8m-cal", "rc128k", "external"]) expect(msg).toContain(id);
    // each option readable on its own: separated, not run together
    expect(msg).toMatch(/Options: [a-z0-9-]+(, [a-z0-9-]+){4}\.$/);
  });

  it("a frequency the internal oscillator cannot make names the two nearest it makes", () => {
    // PIC12F1840 datasheet (DS40001441), OSCCON IRCF<3:0>: 1111 = 16 MHz, 1110 = 8 MHz
    // (HFINTOSC and its postscaler); 15 MHz lies between them.
    const msg = refuse(
      { device: "pic12f1840", clockSource: "hfintosc", clockHz: 15e6 },
      "clock-out-of-range",
      "clockHz",
    ).message;
    expect(msg).toContain("nearest it makes: 8000000 Hz, 16000000 Hz");
  });

  it("clock accuracy: a finite number >= 0, and a given one is the plan's", () => {
    for (const v of [-1, NaN, Infinity, "50"])
      refuse({ clockAccuracyPpm: v }, "invalid-request", "clockAccuracyPpm");
    expect(planTarget({ ...ok, clockAccuracyPpm: 30 }).clockAccuracyPpm).toBe(30);
  });

  it("NaN, Infinity, zero and negative numbers", () => {
    for (const v of [NaN, Infinity, -Infinity, 0, -1, "1e-3", undefined])
      refuse({ periodS: v }, "invalid-request", "periodS");
    for (const v of [NaN, Infinity, 0, -5]) refuse({ clockHz: v }, "invalid-request", "clockHz");
    refuse({ highS: NaN }, "invalid-request", "highS");
    refuse({ mode: "burst" }, "invalid-request", "mode");
    refuse({ clockSource: "quartz" }, "invalid-request", "clockSource");
  });

  it("high time at or beyond the period, or not above zero", () => {
    refuse({ highS: 1e-3 }, "invalid-high-time", "highS");
    refuse({ highS: 2e-3 }, "invalid-high-time", "highS");
    refuse({ highS: 0 }, "invalid-high-time", "highS");
    refuse({ highS: -1e-4 }, "invalid-high-time", "highS");
  });

  it("a period below every mode says what would work", () => {
    // 50 ns is 0.8 clock at 16 MHz: below the 2-count minimum of any hardware mode.
    const e = refuse({ periodS: 50e-9, highS: 20e-9 }, "unreachable-period", "periodS");
    expect(e.message).toMatch(/pwm .* s to .* s/);
    expect(e.message).toMatch(/isr from/);
  });

  it("a hardware mode out of reach falls back to an interrupt plan with a note", () => {
    // Timer1 fast PWM reaches 1024 * 65536 / 16 MHz = 4.19 s (datasheet formula N(1+TOP)/f).
    const p = planTarget({ ...ok, periodS: 60, highS: 1 });
    expect(p.mode).toBe("isr");
    expect(p.requestedMode).toBe("pwm");
    expect(p.notes.join(" ")).toMatch(/cannot make 60 s/);
    expect(p.periodErrorPpm).toBe(0);
  });

  it("plans never carry NaN or Infinity", () => {
    const p = planTarget({ device: "rp2040", clockHz: 125e6, periodS: 1e-7, highS: 4e-8 });
    const walk = (v: unknown): void => {
      if (typeof v === "number") expect(Number.isFinite(v)).toBe(true);
      else if (v && typeof v === "object") Object.values(v).forEach(walk);
    };
    walk(p);
    expect(p.notes.join(" ")).toMatch(/high-time steps/);
  });

  it("is deterministic", () => {
    const r: PlanRequest = { device: "stm32g031", clockHz: 64e6, periodS: 0.0123457, highS: 0.004 };
    expect(JSON.stringify(planTarget(r))).toBe(JSON.stringify(planTarget(r)));
  });
});
