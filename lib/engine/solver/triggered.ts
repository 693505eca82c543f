// Triggered plans (start "trigger" | "zero-cross"; engine.md section 6): the
// input pin's interrupt starts a timer from 0; the output pulse is on from
// delayCounts to delayCounts + highCounts, then the timer stops until the
// next edge. The least legal divider whose counter holds the whole run gives
// the finest steps, so delay and pulse are each within half a count of the
// request (one count for a delay or pulse shorter than one count). The
// worst-case edge-to-timer-start latency comes from ./trigger-inputs.ts.
// Timer choice: least divider (finest count), then the device's timer order.
import { EngineError } from "../errors";
import type { TimerConfig, TimerSpec } from "../devices";
import type { TimerPlan } from "../plan-types";
import type { CheckedRequest } from "./validate";
import { TRIGGER_INPUTS, inputConditioning } from "./trigger-inputs";

interface Choice {
  timer: TimerSpec;
  divider: number;
  delayCounts: number;
  highCounts: number;
}

function fmt(x: number): string {
  return Number(x.toPrecision(4)).toString();
}

function ppm(achieved: number, target: number): number {
  if (target === 0) return 0;
  const e = ((achieved - target) / target) * 1e6;
  return Math.abs(e) < 1e-6 ? 0 : e;
}

function choose(r: CheckedRequest, delayS: number, pulseS: number): Choice | null {
  let best: Choice | null = null;
  for (const timer of r.timers) {
    const range = timer.counts.isr;
    if (!range) continue;
    for (const d of timer.isrDividers) {
      const delayCounts = Math.max(1, Math.round((delayS * r.clockHz) / d));
      const highCounts = Math.max(1, Math.round((pulseS * r.clockHz) / d));
      // The off edge is a compare at count delay + high, so it must fit the
      // compare register (one below the isr range's count of states).
      if (delayCounts + highCounts > range.max - 1) continue;
      if (!best || d < best.divider) best = { timer, divider: d, delayCounts, highCounts };
      break; // dividers ascend: the first that fits is this timer's finest
    }
  }
  return best;
}

export function planTriggered(r: CheckedRequest): TimerPlan {
  const { start, delayS: targetDelayS, edge, retrigger } = r.trigger;
  if (start === "free") throw new Error("planTriggered needs a triggered start");
  const f = r.clockHz;
  // The active pulse: with activeLow the pin goes low for it, but its width is the same.
  const pulseS = r.activeS;
  const c = choose(r, targetDelayS, pulseS);
  if (!c) {
    // The longest run any timer here can count, in clock cycles: the highest clock that fits.
    const reach = Math.max(
      ...r.timers.map((t) => (t.counts.isr ? t.counts.isr.max * t.isrDividers[t.isrDividers.length - 1] : 0)),
    );
    throw new EngineError(
      "unreachable-period",
      `${r.device.name} at ${fmt(f)} Hz cannot count the delay (delayS) of ${fmt(targetDelayS)} s plus a pulse of ${fmt(pulseS)} s in one timer run${r.timerGiven ? ` of ${r.timers[0].name}` : ""} (at most ${fmt(reach / f)} s): use a clock of ${fmt(reach / (targetDelayS + pulseS))} Hz or less.`,
      "delayS",
    );
  }
  const { timer, divider, delayCounts, highCounts } = c;
  const tin = TRIGGER_INPUTS[r.device.id];
  const latencyCycles = tin.responseCycles + tin.handlerCycles;
  const latencyS = latencyCycles / f;
  const count = divider / f;
  const delayS = delayCounts * count;
  const highS = highCounts * count;
  const config: TimerConfig = {
    mode: "isr",
    divider,
    periodCounts: delayCounts + highCounts,
    modeFactor: 1,
    softwareDivider: 1,
    highCounts,
  };
  const notes: string[] = [
    `${start === "zero-cross" ? "Each mains zero crossing" : "Each trigger"} (${edge} edge on ${tin.input.port}, ${tin.edgeHow[edge]}) starts ${timer.name} from 0: pulse on after ${delayCounts} counts (${fmt(delayS)} s), off ${highCounts} counts later (${fmt(highS)} s), then the timer stops.`,
    `Input edge to timer start: up to ${latencyCycles} clock cycles (${fmt(latencyS)} s): ${tin.basis}. The prescaler's phase adds up to one count (${fmt(count)} s).`,
    `Registers: ${timer.name}'s clock select and top for one run; the start on the edge and the stop after the pulse are written by the handlers. Triggered firmware is generated for the ATmega328P and ATtiny85 (other devices: not yet).`,
  ];
  if (start === "trigger")
    notes.push(
      retrigger === "ignore"
        ? "A trigger while the delay or pulse runs is ignored."
        : "A trigger while the delay or pulse runs starts the delay again (the pulse is cut short).",
    );
  if (start === "zero-cross")
    notes.push(
      edge === "both"
        ? "Both half cycles: the detector's output changes at every zero crossing."
        : `Only ${edge} edges: with a detector that pulses at every crossing this is every half cycle; with a square-wave detector only every other half cycle, so choose "both".`,
    );
  if (r.activeLow) notes.push(`Active-low output: the pin is low for the ${fmt(pulseS)} s pulse.`);
  if (highCounts < 16)
    notes.push(`Only ${highCounts} counts of pulse: pulse width resolution ${fmt(count)} s.`);
  return {
    device: r.device.id,
    timer: timer.name,
    mode: "isr",
    clockHz: f,
    divider,
    periodCounts: delayCounts + highCounts,
    modeFactor: 1,
    softwareDivider: 1,
    highCounts,
    periodS: r.periodS,
    highS,
    periodErrorPpm: 0,
    highErrorPpm: ppm(highS, pulseS),
    registers: timer.registers(config),
    pin: { ...timer.pins.isr! },
    requestedMode: r.mode,
    activeLow: r.activeLow,
    targetPeriodS: r.periodS,
    targetHighS: pulseS,
    prescale: r.device.id === "pic12f1840" ? divider / 4 : divider,
    phaseCorrect: false,
    periodCountsTotal: divider * (delayCounts + highCounts),
    resolutionBits: Math.log2(Math.max(1, highCounts)),
    highResolutionS: count,
    // The start of each run moves by the latency spread and the prescaler phase.
    jitterS: latencyS + count,
    interruptIntervalS: null,
    interruptIntervalCycles: null,
    clockSource: r.clock.id,
    clockAccuracyPpm: r.clockAccuracyPpm,
    notes,
    start,
    delayS,
    targetDelayS,
    delayCounts,
    delayErrorS: delayS - targetDelayS,
    latencyS,
    latencyCycles,
    latencyBasis: tin.basis,
    input: { ...tin.input },
    edge,
    edgeSetting: tin.edgeHow[edge],
    ...(start === "trigger" ? { retrigger } : {}),
    inputConditioning: inputConditioning(start),
  };
}
