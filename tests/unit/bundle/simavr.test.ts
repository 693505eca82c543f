// The generated AVR firmware runs in simavr (Debian simavr); the traced pin's
// measured period and high time equal the plan within one timer count.
// Method: verification recipe (trace prologue compiled beside main.c only in
// the test; VCD per IEEE 1364 section 18). Plans come from planTarget.
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundlePlan, type BundleTargetRequest } from "@/lib/bundle";
import { planTarget } from "@/lib/engine";
import { buildAvr, simulateAvr, tracePrologue, writeText } from "@/tests/tools/avr";
import { measure, parseVcd } from "@/tests/tools/vcd";
import { spec } from "./fixtures";

function simulate(request: BundleTargetRequest, stopWdp: number) {
  const plan = planTarget(request) as BundlePlan;
  const files = buildBundleSources(spec([request]));
  const port = plan.pin.port.charAt(1);
  const bit = Number(plan.pin.port.slice(2));
  const mcu = request.device;
  // first build without the prologue: the bundle alone must build
  const plain = buildAvr(files, mcu, mcu);
  writeText(plain.dir, "sim_trace.c", tracePrologue(mcu, request.clockHz, port, bit, stopWdp));
  const traced = buildAvr(files, mcu, mcu, [`${plain.dir}/sim_trace.c`]);
  const edges = parseVcd(simulateAvr(traced), `P${port}${bit}`);
  const m = measure(edges);
  return { plan, m };
}

function expectWithinOneCount(
  plan: BundlePlan,
  m: { periods: number[]; highs: number[] },
  minPeriods: number,
) {
  const count = plan.divider / plan.clockHz;
  // the first period includes the start-up; the rest are steady state
  const periods = m.periods.slice(1);
  const highs = m.highs.slice(1, -1);
  expect(periods.length).toBeGreaterThanOrEqual(minPeriods);
  for (const p of periods) expect(Math.abs(p - plan.periodS)).toBeLessThanOrEqual(count);
  for (const h of highs) expect(Math.abs(h - plan.highS)).toBeLessThanOrEqual(count);
}

describe("AVR firmware in simavr", () => {
  it("ATmega328P Timer1 fast PWM mode 14: 20 ms period, 1.5 ms high", () => {
    const { plan, m } = simulate(
      { device: "atmega328p", clockHz: 16e6, periodS: 0.02, highS: 0.0015, mode: "pwm" },
      4,
    );
    expect(plan.timer).toBe("TIMER1");
    expect(plan.mode).toBe("pwm");
    expectWithinOneCount(plan, m, 8);
  });

  it("ATmega328P interrupt plan with a software divider: 50 ms period, 10 ms high", () => {
    const { plan, m } = simulate(
      { device: "atmega328p", clockHz: 16e6, periodS: 0.05, highS: 0.01, mode: "isr" },
      5,
    );
    expect(plan.mode).toBe("isr");
    expect(plan.softwareDivider).toBeGreaterThan(1);
    expectWithinOneCount(plan, m, 6);
  });

  it("ATtiny85 Timer0 fast PWM (TOP = OCR0A) on OC0B: 2 ms period, 0.5 ms high", () => {
    const { plan, m } = simulate(
      { device: "attiny85", clockHz: 8e6, periodS: 2e-3, highS: 0.5e-3, mode: "pwm", timer: "TIMER0" },
      1,
    );
    expect(plan.timer).toBe("TIMER0");
    expectWithinOneCount(plan, m, 8);
  });

  it("ATtiny85 Timer0 CTC toggle on OC0A: 2 ms period, 50 % duty", () => {
    const { plan, m } = simulate(
      { device: "attiny85", clockHz: 8e6, periodS: 2e-3, highS: 1e-3, mode: "toggle", timer: "TIMER0" },
      1,
    );
    expect(plan.mode).toBe("toggle");
    expectWithinOneCount(plan, m, 8);
  });
});
