// The fast solver against an enumeration of every (divider, counter) pair
// (engine.md section 3): full spaces for the AVR, PIC and MSP430 timers,
// sampled divider and counter ranges for STM32 TIM2/TIM3 and the RP2040.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DEVICES, type TimerSpec } from "@/lib/engine/devices";
import { bestHardware, bestIsr, bruteForceBestIsr, bruteForceBestPeriod } from "@/lib/engine/solver";

const timer = (device: string, name: string) =>
  DEVICES.find((d) => d.id === device)!.timers.find((t) => t.name === name)!;

function agree(t: TimerSpec, mode: "pwm" | "toggle", clockHz: number, periodS: number) {
  const fast = bestHardware(t, mode, periodS * clockHz * t.dividerQuantum)!;
  const slow = bruteForceBestPeriod(t, mode, clockHz, periodS)!;
  expect([fast.divider, fast.periodCounts, fast.modeFactor, fast.errorQuanta]).toEqual([
    slow.divider,
    slow.periodCounts,
    slow.modeFactor,
    slow.errorQuanta,
  ]);
}

// log-uniform period between the shortest and a bit beyond the longest hardware period
const period = (t: TimerSpec, mode: "pwm" | "toggle", clockHz: number) => {
  const r = t.counts[mode]!;
  const m = t.modeFactors[mode]!;
  const lo = Math.log((t.dividers[0] * r.min * Math.min(...m)) / clockHz);
  const hi = Math.log((1.2 * t.dividers[t.dividers.length - 1] * r.max * Math.max(...m)) / clockHz);
  return fc.double({ min: 0, max: 1, noNaN: true }).map((u) => Math.exp(lo + u * (hi - lo)));
};

const small: [string, string, "pwm" | "toggle", number][] = [
  ["atmega328p", "TIMER1", "pwm", 16e6],
  ["atmega328p", "TIMER1", "toggle", 16e6],
  ["atmega328p", "TIMER2", "pwm", 14.7456e6],
  ["attiny85", "TIMER1", "pwm", 8e6],
  ["attiny85", "TIMER0", "toggle", 8e6],
  ["pic12f1840", "TIMER2", "pwm", 32e6],
  ["msp430g2553", "TIMER0_A3", "pwm", 16e6],
  ["msp430g2553", "TIMER0_A3", "toggle", 1e6],
];

describe("hardware modes: fast solver equals exhaustive enumeration", () => {
  for (const [dev, name, mode, hz] of small)
    it(`${dev} ${name} ${mode} (full space)`, () => {
      const t = timer(dev, name);
      fc.assert(
        fc.property(period(t, mode, hz), (p) => agree(t, mode, hz, p)),
        { numRuns: t.bits > 8 ? 15 : 60, seed: 4 },
      );
    });

  it("stm32g031 TIM3 on sampled prescalers, TIM2 on a sampled counter range", () => {
    const t3 = timer("stm32g031", "TIM3");
    const sampled: TimerSpec = { ...t3, dividers: [1, 2, 3, 7, 10, 64, 99, 1000, 4096, 65535, 65536] };
    fc.assert(
      fc.property(period(sampled, "pwm", 64e6), (p) => agree(sampled, "pwm", 64e6, p)),
      { numRuns: 15, seed: 5 },
    );
    const t2 = timer("stm32g031", "TIM2");
    const narrow: TimerSpec = { ...t2, dividers: [1, 5, 16, 333], counts: { pwm: { min: 2, max: 200000 } } };
    fc.assert(
      fc.property(period(narrow, "pwm", 48e6), (p) => agree(narrow, "pwm", 48e6, p)),
      { numRuns: 10, seed: 6 },
    );
  });

  it("rp2040 slice on sampled fractional dividers, both edge-aligned and phase-correct", () => {
    const t = timer("rp2040", "PWM0");
    const sampled: TimerSpec = {
      ...t,
      dividers: [1, 1.0625, 2.5, 9.8125, 100, 195.3125, 255.9375],
      counts: { pwm: { min: 2, max: 20000 } },
    };
    fc.assert(
      fc.property(period(sampled, "pwm", 125e6), (p) => agree(sampled, "pwm", 125e6, p)),
      { numRuns: 20, seed: 7 },
    );
  });
});

describe("interrupt plans: factorisation search equals exhaustive enumeration", () => {
  const cases: [string, string, number, number][] = [
    ["attiny85", "TIMER0", 8e6, 500],
    ["atmega328p", "TIMER2", 16e6, 500],
    ["pic12f1840", "TIMER2", 32e6, 2000],
    ["msp430g2553", "TIMER0_A3", 1e6, 500],
  ];
  for (const [dev, name, hz, minInterval] of cases)
    it(`${dev} ${name}`, () => {
      const t = timer(dev, name);
      const target = fc
        .tuple(
          fc.double({ min: Math.log(2e-3), max: Math.log(20), noNaN: true }),
          fc.double({ min: 0.01, max: 0.99, noNaN: true }),
        )
        .map(([lp, duty]) => [Math.exp(lp), Math.exp(lp) * duty] as const);
      fc.assert(
        fc.property(target, ([p, h]) => {
          const fast = bestIsr(t, p * hz, h * hz, minInterval)!;
          const slow = bruteForceBestIsr(t, hz, p, h, minInterval)!;
          expect(fast.periodErrorCycles).toBe(slow.periodErrorCycles);
          expect(fast.highErrorCycles).toBe(slow.highErrorCycles);
          expect([fast.intervalCycles, fast.divider]).toEqual([slow.intervalCycles, slow.divider]);
        }),
        { numRuns: t.bits > 8 ? 6 : 25, seed: 8 },
      );
    });
});
