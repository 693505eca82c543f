// Turns a solved configuration into the reported plan: achieved times,
// errors, resolution, jitter, registers, pin and notes.
import type { TimerConfig, TimerSpec } from "../devices";
import type { TimerPlan } from "../plan-types";
import type { CheckedRequest } from "./validate";

/** Relative errors below this are float noise of an exact setting. */
const EXACT_PPM = 1e-6;

function ppm(achieved: number, target: number): number {
  const e = ((achieved - target) / target) * 1e6;
  return Math.abs(e) < EXACT_PPM ? 0 : e;
}

function fmt(x: number): string {
  return Number(x.toPrecision(4)).toString();
}

export function describePlan(
  r: CheckedRequest,
  timer: TimerSpec,
  c: TimerConfig,
  notes: string[],
): TimerPlan {
  const f = r.clockHz;
  const { divider, periodCounts, modeFactor, softwareDivider, highCounts, mode } = c;
  const periodCountsTotal = divider * periodCounts * modeFactor * softwareDivider;
  const periodS = (divider * periodCounts * modeFactor * softwareDivider) / f;
  let highS: number;
  let steps: number;
  let highResolutionS: number;
  if (mode === "pwm") {
    highS = (divider * modeFactor * highCounts) / f;
    steps = periodCounts / timer.highStep;
    highResolutionS = (divider * modeFactor * timer.highStep) / f;
  } else if (mode === "toggle") {
    highS = periodS / 2;
    steps = 2;
    highResolutionS = periodS / 2;
  } else {
    highS = (highCounts * divider * periodCounts) / f;
    steps = softwareDivider;
    highResolutionS = (divider * periodCounts) / f;
  }
  const fractional = timer.dividerQuantum > 1 && !Number.isInteger(divider);
  const jitterS = mode === "isr" ? r.device.isrLatencyCycles / f : fractional ? 1 / f : 0;
  const div16 = Math.round(divider * 16);
  const rp = r.device.id === "rp2040";

  const plan: TimerPlan = {
    device: r.device.id,
    timer: timer.name,
    mode,
    clockHz: f,
    divider,
    periodCounts,
    modeFactor,
    softwareDivider,
    highCounts,
    periodS,
    highS,
    periodErrorPpm: ppm(periodS, r.periodS),
    highErrorPpm: ppm(highS, r.highS),
    registers: timer.registers(c, r.clock),
    pin: { ...timer.pins[mode]! },
    requestedMode: r.mode,
    activeLow: r.activeLow,
    targetPeriodS: r.periodS,
    targetHighS: r.highS,
    prescale: r.device.id === "pic12f1840" ? divider / 4 : divider,
    ...(rp ? { divInt: div16 >> 4, divFrac: div16 & 15 } : {}),
    phaseCorrect: mode === "pwm" && modeFactor === 2,
    periodCountsTotal,
    resolutionBits: Math.log2(steps),
    highResolutionS,
    jitterS,
    interruptIntervalS: mode === "isr" ? (divider * periodCounts) / f : null,
    interruptIntervalCycles: mode === "isr" ? divider * periodCounts : null,
    clockSource: r.clock.id,
    clockAccuracyPpm: r.clockAccuracyPpm,
    notes,
  };
  addNotes(plan, r, timer, c, fractional, steps);
  return plan;
}

function addNotes(
  p: TimerPlan,
  r: CheckedRequest,
  timer: TimerSpec,
  c: TimerConfig,
  fractional: boolean,
  steps: number,
): void {
  const n = p.notes;
  if (r.activeLow)
    n.push(
      `Active-low output: the pin is low for the old stage's ${fmt(r.activeS)} s pulse and high for ${fmt(r.highS)} s; high-time figures are the pin's.`,
    );
  if (timer.notes) n.push(...timer.notes(c));
  if (c.mode === "toggle") n.push("Compare toggle gives a fixed 50 % duty cycle.");
  if (c.mode === "pwm" && timer.highStep < 1)
    n.push(`10-bit duty: high time in quarter counts (${fmt(p.highResolutionS)} s steps).`);
  if (p.phaseCorrect) n.push("Phase-correct (up-down) counting doubles the period per count.");
  if (fractional)
    n.push(
      `Fractional divider ${p.divInt} + ${p.divFrac}/16: single periods vary by one system clock (${fmt(p.jitterS)} s); the average is as stated.`,
    );
  if (c.mode === "isr")
    n.push(
      `Output edges written in the timer interrupt every ${p.interruptIntervalCycles} clock cycles; edge jitter up to ${r.device.isrLatencyCycles} cycles (${fmt(p.jitterS)} s; ${r.device.isrLatencySource}), more if other interrupts run.`,
    );
  if (steps < 16)
    n.push(
      `Only ${fmt(steps)} high-time steps per period (${fmt(p.resolutionBits)} bits): high time resolution ${fmt(p.highResolutionS)} s.`,
    );
  if (c.mode !== "toggle" && Math.abs(p.highErrorPpm) > 1e4 && p.highS !== r.highS)
    n.push(`High time ${fmt(r.highS)} s is not reachable within 1 %: nearest ${fmt(p.highS)} s.`);
  if (r.clock.hz !== undefined && Math.abs(r.clock.hz - r.clockHz) > r.clock.hz * 1e-9)
    n.push(`Clock option ${r.clock.id} is ${fmt(r.clock.hz)} Hz but the plan uses ${fmt(r.clockHz)} Hz.`);
}
