// Triggered and zero-cross firmware on the AVRs (engine.md section 6), run in
// simavr with the input pin driven by lib/firmware/emulate/harness/simavr/trigger-trace.c.
// Contract checked: each selected input edge is followed by one output pulse;
// delay = delayCounts counts within one count (the prescaler phase) plus the
// plan's latencyCycles; width = highCounts counts within one count.
// Latency basis: ATmega328P datasheet DS40002061 "Interrupt Response Time"
// (4 cycles minimum) and the ATtiny85 datasheet's section of the same name,
// with the handlers' cycles from the AVR Instruction Set Manual.
// Edge selection: EICRA / MCUCR ISC01:0 (External Interrupts chapters).
// Emulator limit seen here: simavr 1.6 did not raise the ATtiny85's INT0 on
// rising edges with ISC01:0 = 01 (any change), so "both" is checked on the
// ATmega328P only; the ATtiny85 runs are single-edge.
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleTargetRequest } from "@/lib/bundle";
import { planTarget, type TimerPlan } from "@/lib/engine";
import { buildFolder, pulsesAfter, runTriggered } from "../../tools/simavr-trigger";

const stage = { kind: "timer555-monostable", r: 10e3, c: 1e-6 } as const;

function bundle(target: BundleTargetRequest & Record<string, unknown>) {
  const files = buildBundleSources({
    retrofit: { name: "Trigger proof" },
    revision: 1,
    stage,
    targets: [target],
  });
  const plan = planTarget(target as never) as TimerPlan;
  const folder = files.find((f) => f.path.endsWith("/src/main.c"))!.path.split("/")[0];
  return { files, plan, folder };
}

function check(
  target: BundleTargetRequest & Record<string, unknown>,
  halfS: number,
  edge: "rising" | "falling" | "both",
  edit?: (c: string) => string,
) {
  const { files, plan, folder } = bundle(target);
  const hex = buildFolder(files, folder, edit);
  const f = target.clockHz;
  const half = Math.round(halfS * f);
  const run = runTriggered(hex, {
    mcu: target.device,
    clockHz: f,
    out: plan.pin.port,
    input: plan.input!.port,
    firstCycles: 50_000,
    halfCycles: half,
    cycles: 50_000 + 6 * half,
  });
  const n = plan.divider;
  const pulses = pulsesAfter(run, edge, "1");
  const wantDelay = plan.delayCounts! * n;
  const wantWidth = plan.highCounts * n;
  const bad = pulses.filter(
    (p) =>
      !(p.delay >= wantDelay - n && p.delay <= wantDelay + n + plan.latencyCycles!) ||
      !(Math.abs(p.width - wantWidth) <= n),
  );
  return { pulses, bad, plan, run };
}

describe("AVR triggered firmware in simavr", () => {
  it.each([50, 60])(
    "ATmega328P zero-cross at %i Hz: a pulse after every crossing (both half cycles)",
    (hz) => {
      const halfS = 1 / (2 * hz);
      const r = check(
        {
          device: "atmega328p",
          clockHz: 16e6,
          periodS: halfS,
          highS: 100e-6,
          start: "zero-cross",
          delayS: 0.3 * halfS,
        },
        halfS,
        "both",
      );
      expect(r.pulses.length).toBeGreaterThanOrEqual(5);
      expect(r.bad).toEqual([]);
    },
  );

  it("ATmega328P trigger on falling edges, restart rule, prescaler 64", () => {
    const r = check(
      {
        device: "atmega328p",
        clockHz: 16e6,
        periodS: 0.2,
        highS: 0.01,
        start: "trigger",
        delayS: 0.02,
        edge: "falling",
        retrigger: "restart",
      },
      0.1,
      "falling",
    );
    expect(r.plan.divider).toBeGreaterThan(1);
    expect(r.pulses.length).toBe(3);
    expect(r.bad).toEqual([]);
    // No pulse follows a rising edge: only as many pulses as falling edges.
    expect(r.run.output.filter((o) => o.level === "1").length).toBe(3);
  });

  it("ATtiny85 trigger on falling edges", () => {
    const r = check(
      {
        device: "attiny85",
        clockHz: 8e6,
        periodS: 0.02,
        highS: 0.002,
        start: "trigger",
        delayS: 0.004,
        edge: "falling",
      },
      0.01,
      "falling",
    );
    expect(r.pulses.length).toBe(3);
    expect(r.bad).toEqual([]);
  });

  // Planted faults: the harness must catch each one.
  it("catches a wrong edge (rising instead of falling)", () => {
    const r = check(
      {
        device: "atmega328p",
        clockHz: 16e6,
        periodS: 0.2,
        highS: 0.01,
        start: "trigger",
        delayS: 0.02,
        edge: "falling",
      },
      0.1,
      "falling",
      (c) => c.replace("EICRA = (1 << ISC01);", "EICRA = (1 << ISC01) | (1 << ISC00);"),
    );
    expect(r.bad.length).toBeGreaterThan(0);
  });

  it("catches a delay two counts long", () => {
    const { plan } = bundle({
      device: "atmega328p",
      clockHz: 16e6,
      periodS: 0.2,
      highS: 0.01,
      start: "trigger",
      delayS: 0.02,
      edge: "falling",
    });
    const r = check(
      {
        device: "atmega328p",
        clockHz: 16e6,
        periodS: 0.2,
        highS: 0.01,
        start: "trigger",
        delayS: 0.02,
        edge: "falling",
      },
      0.1,
      "falling",
      (c) => c.replace(`OCR1A = ${plan.delayCounts}u;`, `OCR1A = ${plan.delayCounts! + 2}u;`),
    );
    expect(r.bad.length).toBeGreaterThan(0);
  });
});
