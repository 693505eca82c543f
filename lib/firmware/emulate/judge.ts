// Turns the output pin's edges from an emulator run into an EmulationResult:
// periods between rising edges and high times from each rising edge to the
// next falling one, the first period left out (it holds the start-up) and a
// high time cut by the end of the run dropped. Every measured period and high
// time must lie within the plan's tolerance plus the emulator's own time step,
// else "differs" with the largest deviation named. Shared by every device wrapper.
import { formatEng } from "@/lib/engine/units";
import type { EmulationInput, EmulationResult } from "./types";

/** How many of the pin's first edges a result keeps (enough to draw two or three periods). */
export const KEPT_EDGES = 12;
/** Full periods a run must show after the start-up period to say anything. */
export const MIN_PERIODS = 3;

export type PinEdge = { t: number; level: 0 | 1 };

const s = (x: number) => formatEng(x, "s", 6);

/** Rising-to-rising periods and rising-to-falling high times, skipping the first period. */
export function periodsAndHighs(edges: PinEdge[]): { periods: number[]; highs: number[] } {
  const rises = edges.filter((e) => e.level === 1).map((e) => e.t);
  const periods: number[] = [];
  const highs: number[] = [];
  for (let i = 1; i + 1 < rises.length; i++) {
    periods.push(rises[i + 1] - rises[i]);
    const fall = edges.find((e) => e.level === 0 && e.t > rises[i]);
    if (fall && fall.t < rises[i + 1]) highs.push(fall.t - rises[i]);
  }
  return { periods, highs };
}

/** Only real edges: each one changes the level. */
export function cleanEdges(edges: PinEdge[]): PinEdge[] {
  return edges.filter((e, i) => i === 0 || edges[i - 1].level !== e.level);
}

function worst(values: number[], want: number): number {
  return values.reduce((w, v) => (Math.abs(v - want) > Math.abs(w) ? v - want : w), 0);
}

const mean = (v: number[]) => v.reduce((a, b) => a + b, 0) / v.length;

export function judgeEdges(
  input: EmulationInput,
  rawEdges: PinEdge[],
  run: {
    tool: string;
    emulatedS: number;
    /** the emulator's time resolution at the pin (simavr: one CPU cycle), added to both tolerances */
    stepS: number;
  },
): EmulationResult {
  const edges = cleanEdges(rawEdges);
  const kept = edges.slice(0, KEPT_EDGES);
  const base = { tool: run.tool, emulatedS: run.emulatedS, edges: kept };
  const { periods, highs } = periodsAndHighs(edges);
  const { pin, periodS, highS } = input.planned;
  const tol = { period: input.toleranceS.period + run.stepS, high: input.toleranceS.high + run.stepS };
  if (periods.length < MIN_PERIODS || highs.length === 0) {
    return {
      ...base,
      verdict: "differs",
      reason: `${pin} showed ${edges.length} edges in ${s(run.emulatedS)} of emulated time; the plan's ${s(periodS)} period needs at least ${MIN_PERIODS + 2} rising edges there.`,
    };
  }
  const dp = worst(periods, periodS);
  const dh = worst(highs, highS);
  const measured = { periodS: mean(periods), highS: mean(highs) };
  const problems: string[] = [];
  if (Math.abs(dp) > tol.period)
    problems.push(`period by ${dp > 0 ? "+" : ""}${s(dp)} (plan ${s(periodS)} ± ${s(tol.period)})`);
  if (Math.abs(dh) > tol.high)
    problems.push(`high time by ${dh > 0 ? "+" : ""}${s(dh)} (plan ${s(highS)} ± ${s(tol.high)})`);
  const over = `over ${periods.length} periods on ${pin}`;
  if (problems.length > 0)
    return { ...base, ...measured, verdict: "differs", reason: `Differs ${over}: ${problems.join("; ")}.` };
  return {
    ...base,
    ...measured,
    verdict: "agrees",
    reason: `Agrees ${over}: period ${s(measured.periodS)} (plan ${s(periodS)} ± ${s(tol.period)}), high ${s(measured.highS)} (plan ${s(highS)} ± ${s(tol.high)}).`,
  };
}
