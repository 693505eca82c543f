// Solver part: planTarget for all six devices on a seeded batch of random
// targets, then the timer solvers against brute-force enumeration of every
// (divider, counter) pair on the same targets.
import { seededRandom, planTarget, EngineError, type PlanRequest, type TimerMode } from "@/lib/engine";
import { DEVICES, type DeviceSpec, type TimerSpec } from "@/lib/engine/devices";
import {
  bestHardware,
  bestIsr,
  bruteForceBestIsr,
  bruteForceBestPeriod,
  minIsrIntervalCycles,
} from "@/lib/engine/solver";
import { referenceSpace, sameHardwareError, sameIsrError, tally, type ComparisonRow } from "./compare";
import { figure, type Figure } from "./figures";

const SEED = 20240611;
const PLANS_PER_DEVICE = 100;
const COMPARED_PER_DEVICE = 20;
// Per timer and target: keeps the whole comparison under a minute on two cores.
const MAX_PAIRS = { hardware: 600_000, isr: 200_000 };
// Fast solver calls are microseconds: repeat them so the timer resolution does not matter.
const FAST_REPEAT = 20;

export interface Target extends PlanRequest {
  mode: TimerMode;
}

function modesOf(d: DeviceSpec): TimerMode[] {
  return (["pwm", "toggle", "isr"] as const).filter((m) => d.timers.some((t) => t.counts[m]));
}

/** Clock rates from the device's own clock options (fixed rates, or the top of a range), 1 MHz and up. */
function clockRates(d: DeviceSpec): number[] {
  const rates = d.clocks.map((c) => c.hz ?? c.maxHz ?? 0).filter((hz) => hz >= 1e6);
  return [...new Set(rates)];
}

/** Period log-uniform 50 us .. 2 s, duty 5..95 %. */
export function randomTargets(rand: () => number, perDevice: number): Target[] {
  const out: Target[] = [];
  for (const d of DEVICES) {
    const modes = modesOf(d);
    const rates = clockRates(d);
    for (let i = 0; i < perDevice; i++) {
      const periodS = Math.exp(Math.log(50e-6) + rand() * Math.log(2 / 50e-6));
      out.push({
        device: d.id,
        clockHz: rates[Math.floor(rand() * rates.length)],
        mode: modes[Math.floor(rand() * modes.length)],
        periodS,
        highS: periodS * (0.05 + 0.9 * rand()),
      });
    }
  }
  return out;
}

function timeFast<T>(fn: () => T): { value: T; ms: number } {
  const t0 = performance.now();
  let value = fn();
  for (let i = 1; i < FAST_REPEAT; i++) value = fn();
  return { value, ms: (performance.now() - t0) / FAST_REPEAT };
}

function timeOnce<T>(fn: () => T): { value: T; ms: number } {
  const t0 = performance.now();
  const value = fn();
  return { value, ms: performance.now() - t0 };
}

/** Distinct timer shapes of a device (the eight RP2040 slices are one shape). */
function distinctTimers(d: DeviceSpec): TimerSpec[] {
  const seen = new Map<string, TimerSpec>();
  for (const t of d.timers) {
    const key = JSON.stringify([
      t.dividers.length,
      t.dividers[0],
      t.isrDividers.length,
      t.counts,
      t.modeFactors,
    ]);
    if (!seen.has(key)) seen.set(key, t);
  }
  return [...seen.values()];
}

/**
 * Interrupt plans need two intervals of at least minIsrIntervalCycles: below
 * that the fast solver reports "out of reach" (planTarget throws), while the
 * enumeration still returns its nearest total. Those targets are not compared.
 */
function belowIsrFloor(d: DeviceSpec, target: Target): boolean {
  return target.mode === "isr" && target.periodS * target.clockHz < 2 * minIsrIntervalCycles(d) - 0.5;
}

function compareOne(d: DeviceSpec, t: TimerSpec, target: Target, full: boolean): ComparisonRow {
  const label = `${d.id} ${t.name}${full ? "" : " (sampled)"} ${target.mode} ${target.periodS.toPrecision(6)} s @ ${target.clockHz} Hz`;
  if (target.mode === "isr") {
    const minInterval = minIsrIntervalCycles(d);
    const fast = timeFast(() =>
      bestIsr(t, target.periodS * target.clockHz, target.highS * target.clockHz, minInterval),
    );
    const brute = timeOnce(() =>
      bruteForceBestIsr(t, target.clockHz, target.periodS, target.highS, minInterval),
    );
    return { label, same: sameIsrError(fast.value, brute.value), fastMs: fast.ms, bruteMs: brute.ms };
  }
  const mode = target.mode;
  const fast = timeFast(() => bestHardware(t, mode, target.periodS * target.clockHz * t.dividerQuantum));
  const brute = timeOnce(() => bruteForceBestPeriod(t, mode, target.clockHz, target.periodS));
  return { label, same: sameHardwareError(fast.value, brute.value), fastMs: fast.ms, bruteMs: brute.ms };
}

export async function solverPart(log: (s: string) => void) {
  const rand = seededRandom(SEED);
  const targets = randomTargets(rand, PLANS_PER_DEVICE);

  // Warm-up: one pass over a few targets so the JIT has compiled the solver.
  for (const t of targets.filter((_, i) => i % 10 === 0)) tryPlan(t);
  const perDevice: Record<string, { plans: number; fallbacks: number; unreachable: number; ms: number }> = {};
  const t0 = performance.now();
  for (const t of targets) {
    const s = (perDevice[t.device] ??= { plans: 0, fallbacks: 0, unreachable: 0, ms: 0 });
    const a = performance.now();
    const r = tryPlan(t);
    s.ms += performance.now() - a;
    s.plans++;
    if (r === "unreachable") s.unreachable++;
    else if (r === "fallback") s.fallbacks++;
  }
  const planMs = performance.now() - t0;
  const slowest = Object.entries(perDevice).sort((a, b) => b[1].ms - a[1].ms)[0];
  log(
    `solver: ${targets.length} plans in ${planMs.toFixed(0)} ms; per device ms: ` +
      Object.entries(perDevice)
        .map(([k, v]) => `${k} ${v.ms.toFixed(0)}`)
        .join(", "),
  );

  // Comparison on the first COMPARED_PER_DEVICE targets of each device.
  const rows: ComparisonRow[] = [];
  const spaces: string[] = [];
  let belowFloor = 0;
  for (const d of DEVICES) {
    const chosen = targets.filter((t) => t.device === d.id).slice(0, COMPARED_PER_DEVICE);
    for (const timer of distinctTimers(d)) {
      const ref = referenceSpace(timer, MAX_PAIRS, rand);
      spaces.push(
        `${d.id} ${timer.name}: ${ref.full ? "every pair" : `${ref.timer.dividers.length} of ${timer.dividers.length} dividers, counts to ${ref.timer.counts.pwm?.max ?? ref.timer.counts.isr?.max}`}`,
      );
      for (const target of chosen) {
        if (!ref.timer.counts[target.mode]) continue;
        if (target.mode !== "isr" && !ref.timer.modeFactors[target.mode]) continue;
        if (belowIsrFloor(d, target)) {
          belowFloor++;
          continue;
        }
        rows.push(compareOne(d, ref.timer, target, ref.full));
      }
    }
    log(`solver: compared ${d.id}`);
  }
  const t = tally(rows);
  const figures: Figure[] = [
    figure(
      "solver: plan 6 devices",
      planMs,
      "ms",
      undefined,
      `${targets.length} random targets, ${(planMs / targets.length).toFixed(2)} ms each; slowest ${slowest[0]}`,
    ),
    figure(
      "solver: same error as brute force",
      t.sharePct,
      "%",
      { op: ">=", value: 100 },
      `${t.same}/${t.compared} timer x target pairs; ${belowFloor} isr targets under the 2 x 500-cycle interrupt floor not compared`,
    ),
    figure(
      "solver: brute-force / fast time",
      t.ratio,
      "x",
      undefined,
      `brute ${t.bruteMs.toFixed(0)} ms, fast ${t.fastMs.toFixed(2)} ms`,
    ),
  ];
  return { figures, details: { seed: SEED, perDevice, comparison: { ...t, belowFloor, spaces } } };
}

function tryPlan(t: Target): "ok" | "fallback" | "unreachable" {
  try {
    const plan = planTarget(t);
    return plan.mode === t.mode ? "ok" : "fallback";
  } catch (e) {
    if (e instanceof EngineError) return "unreachable";
    throw e;
  }
}
