import { describe, expect, it } from "vitest";
import { buildAdcTable, stepForCount, type Stage } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

const LN2 = Math.log(2);
// 555 astable, rate pot as Rb (NE555 datasheet SLFS022: T = ln2*(Ra + 2*Rb)*C).
const astable: Stage = { kind: "timer555-astable", supplyV: 12, ra: 1e3, rb: 10e3, c: 1e-6 };
const pot = { kind: "pot", field: "rb", seriesR: 2.2e3, trackR: 47e3, taper: "linear" } as const;

describe("ADC table of a rate pot on the ATmega328P (Timer1 fast PWM, datasheet DS40002061)", () => {
  const table = buildAdcTable({
    stage: astable,
    control: pot,
    device: "atmega328p",
    clockHz: 16e6,
    adcBits: 10,
    steps: 64,
  });
  const tick = table.plan.divider / 16e6;

  it("holds the stage's own period at every step within half a timer count", () => {
    expect(table.steps).toHaveLength(64);
    expect(table.countsPerStep).toBe(16);
    for (const s of table.steps) {
      const rb = 2.2e3 + 47e3 * s.rotation;
      expect(s.wantS / (LN2 * (1e3 + 2 * rb) * 1e-6)).toBeCloseTo(1, 9);
      expect(Math.abs(s.periodS - s.wantS)).toBeLessThanOrEqual(tick / 2 + 1e-15);
    }
    // one divider for the table: the longest step is the one the solver planned
    expect(table.steps.at(-1)!.periodCounts).toBe(table.plan.periodCounts);
  });

  it("states resolution: the worst step is the relative jump between neighbours", () => {
    // Linear law: the largest relative jump is at the short end, 2*dRb/(Ra + 2*Rb_min).
    const dRb = 47e3 / 63;
    // Each end of the jump is rounded to the nearest count: allow one count of the shortest period.
    const ideal = (2 * dRb) / (1e3 + 2 * 2.2e3);
    expect(Math.abs(table.worstStepPpm / 1e6 - ideal)).toBeLessThan(tick / table.steps[0].wantS);
    expect(table.worstErrorPpm).toBeLessThan((1e6 * (tick / 2)) / table.steps[0].wantS + 1e-6);
  });

  it("keeps the step within the hysteresis and moves past it", () => {
    const h = table.hysteresisCounts;
    expect(stepForCount(16 + 15 + h, 1, 16, h, 64)).toBe(1);
    expect(stepForCount(16 + 16 + h, 1, 16, h, 64)).toBe(2);
    expect(stepForCount(16 - h, 1, 16, h, 64)).toBe(1);
    expect(stepForCount(16 - h - 1, 1, 16, h, 64)).toBe(0);
    expect(stepForCount(1023, 0, 16, h, 64)).toBe(63);
  });
});

describe("bad ADC table requests name their field", () => {
  const base = { stage: astable, control: pot, device: "atmega328p", clockHz: 16e6, adcBits: 10, steps: 64 };
  it.each([
    [{ steps: 48 }, "steps"],
    [{ adcBits: 8 }, "adcBits"],
    [{ hysteresisCounts: 8 }, "hysteresisCounts"],
    [{ control: { kind: "trimmer", field: "rb", trackR: 1e3 } }, "control.kind"],
  ])("%j", (patch, field) => {
    const err = expectEngineError(() => buildAdcTable({ ...base, ...patch }), "invalid-request");
    expect(err.field).toBe(field);
  });
  it("sends a trimmer and a mains-synchronised pot elsewhere, saying where", () => {
    const trimmer = expectEngineError(
      () => buildAdcTable({ ...base, control: { kind: "trimmer", field: "rb", trackR: 1e3 } }),
      "invalid-request",
    );
    expect(trimmer.field).toBe("control.kind");
    expect(trimmer.message).toBe(
      "Only a potentiometer is read on an ADC pin; a trimmer becomes a calibration constant and a selector input pins.",
    );
    // A UJT firing stage on 50 Hz mains: its pot sets the firing delay after
    // each zero crossing, which a free-running rate table cannot express.
    const synced: Stage = {
      kind: "ujt",
      supplyV: 20,
      timingR: 47e3,
      timingC: 100e-9,
      eta: 0.63,
      sync: { mainsHz: 50, mainsVrms: 230 },
    };
    const sync = expectEngineError(
      () =>
        buildAdcTable({
          ...base,
          stage: synced,
          control: { kind: "pot", field: "timingR", seriesR: 10e3, trackR: 47e3, taper: "linear" },
        }),
      "invalid-request",
    );
    expect(sync.field).toBe("stage.sync");
    expect(sync.message).toBe(
      "A mains-synchronised stage's control sets the firing delay: its ADC table comes with the zero-cross firmware, not this free-running table.",
    );
  });
  it("refuses a travel that leaves the stage's limits", () => {
    const ujt: Stage = { kind: "ujt", supplyV: 12, timingR: 47e3, timingC: 1e-6, eta: 0.63 };
    const err = expectEngineError(
      () =>
        buildAdcTable({
          ...base,
          stage: ujt,
          control: { kind: "pot", field: "timingR", seriesR: 1e5, trackR: 1e6, taper: "linear" },
        }),
      "invalid-request",
    );
    expect(err.field).toBe("control");
  });
});

describe("a log pot read as a divider", () => {
  // Wired as a divider the wiper voltage is the track fraction of the
  // reference whatever the taper (voltage divider rule), so the table is linear
  // in the fraction: R = seriesR + trackR * fraction, and the knob rotation for
  // it follows the log law (10 % of the track at half rotation, common practice).
  const log = { ...pot, taper: "log" } as const;
  const table = buildAdcTable({
    stage: astable,
    control: log,
    device: "atmega328p",
    clockHz: 16e6,
    adcBits: 10,
    steps: 64,
  });
  it("maps each step's fraction to the stage value without applying the taper twice", () => {
    for (const s of table.steps) {
      const rb = 2.2e3 + 47e3 * s.fraction;
      expect(s.wantS / (LN2 * (1e3 + 2 * rb) * 1e-6)).toBeCloseTo(1, 9);
    }
    const at10 = table.steps.find((s) => Math.abs(s.fraction - 0.1) < 0.008)!;
    expect(at10.rotation).toBeCloseTo(0.5, 1);
  });
});
