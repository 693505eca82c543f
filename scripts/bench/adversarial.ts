// Adversarial part: the worst single planTarget and analyzeStage call found
// by a seeded search over long, awkward periods at the fastest clocks, on
// every device and mode (issue 15: one request must not hold the event loop).
// Awkward periods: just below the solver's exact-count limit, near primes and
// products of two large primes (no small factors), and highly composite
// totals (many divisors to pair).
import {
  analyzeStage,
  EngineError,
  planTarget,
  seededRandom,
  type Stage,
  type TimerMode,
} from "@/lib/engine";
import { DEVICES } from "@/lib/engine/devices";
import { forgetLastIsr, isrSearchStats } from "@/lib/engine/solver/isr";
import { figure, type Figure } from "./figures";

const SEED = 15015;
const RANDOM_PER_CLOCK = 12;
const MAX_CYCLES = 2 ** 46;
// Each input runs this often and its fastest run counts, in CPU time of this
// process: the cost of the call, not of whatever else shares the cores.
const RUNS = 5;

function timeOf(fn: () => void): number {
  let best = Infinity;
  for (let i = 0; i < RUNS; i++) {
    forgetLastIsr();
    const t0 = process.cpuUsage();
    try {
      fn();
    } catch (e) {
      if (!(e instanceof EngineError)) throw e;
    }
    const used = process.cpuUsage(t0);
    best = Math.min(best, (used.user + used.system) / 1000);
  }
  return best;
}

function awkwardTotals(rand: () => number): number[] {
  const out = [MAX_CYCLES - 1, MAX_CYCLES - 3, 2 ** 45 + 1, 2 ** 40 - 87, 1e13 + 37];
  // Highly composite: 2^a 3^b 5^c 7^d 11 13 ... below the limit.
  out.push(2 ** 10 * 3 ** 6 * 5 ** 4 * 7 ** 3 * 11 * 13 * 17 * 19);
  out.push(2 ** 12 * 3 ** 5 * 5 ** 3 * 7 ** 2 * 11 * 13 * 17 * 19 * 23);
  // Two primes near 2^23 (no factor fits a 16-bit count).
  out.push(8388593 * 8388587, 65537 * 1073741827);
  for (let i = 0; i < RANDOM_PER_CLOCK; i++) out.push(Math.floor(2 ** (20 + 26 * rand())) | 1);
  return out;
}

function worstPlan(log: (s: string) => void) {
  const rand = seededRandom(SEED);
  let worst = { ms: 0, what: "" };
  let calls = 0;
  for (const device of DEVICES) {
    const hz = device.maxClockHz;
    const modes: TimerMode[] = ["pwm", "toggle", "isr"];
    for (const total of awkwardTotals(rand))
      for (const mode of modes) {
        const periodS = total / hz;
        const request = { device: device.id, clockHz: hz, periodS, highS: periodS * 0.37, mode };
        const ms = timeOf(() => planTarget(request));
        calls++;
        if (ms > worst.ms) worst = { ms, what: `${device.id} ${mode} ${total} cycles at ${hz} Hz` };
      }
  }
  log(`planTarget: ${calls} calls, worst ${worst.ms.toFixed(2)} ms (${worst.what})`);
  return { ...worst, calls };
}

function worstStage(log: (s: string) => void) {
  // Largest parts the stage forms accept, with tolerances (corners + Monte Carlo).
  const stages: Stage[] = [
    {
      kind: "timer555-astable",
      ra: 1e12,
      rb: 1e12,
      c: 100,
      supplyV: 15,
      tolerances: { ra: 0.05, rb: 0.05, c: 0.2 },
    },
    { kind: "timer555-astable", ra: 1e3, rb: 1e3, c: 1e-12, supplyV: 5, tolerances: { c: 0.1 } },
  ] as unknown as Stage[];
  let worst = { ms: 0, what: "" };
  for (const s of stages) {
    const ms = timeOf(() => analyzeStage(s));
    if (ms > worst.ms) worst = { ms, what: (s as { kind: string }).kind };
  }
  log(`analyzeStage: worst ${worst.ms.toFixed(2)} ms (${worst.what})`);
  return worst;
}

export async function adversarialPart(
  log: (s: string) => void,
): Promise<{ figures: Figure[]; details: unknown }> {
  isrSearchStats.capped = 0;
  // First pass warms the JIT and the prime table; the second is measured.
  worstPlan(() => {});
  worstStage(() => {});
  const plan = worstPlan(log);
  const stage = worstStage(log);
  const figures = [
    figure(
      "worst single planTarget, adversarial periods",
      plan.ms,
      "ms CPU",
      { op: "<", value: 10 },
      plan.what,
    ),
    figure(
      "worst single analyzeStage, largest parts",
      stage.ms,
      "ms CPU",
      { op: "<", value: 10 },
      stage.what,
    ),
    figure("interrupt searches that hit the total cap", isrSearchStats.capped, "count", {
      op: "=",
      value: 0,
    }),
  ];
  return { figures, details: { plan, stage, capped: isrSearchStats.capped } };
}
