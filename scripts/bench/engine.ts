// Engine part: analyzeStage with the 10 000-sample Monte Carlo spread.
import { analyzeStage, DEFAULT_SAMPLES } from "@/lib/engine";
import { figure } from "./figures";
import { median, percentile, timeRuns } from "./stats";
import { STAGE } from "./workload";

const WARMUP = 5;
const RUNS = 21;

export async function enginePart(log: (s: string) => void) {
  const once = analyzeStage(STAGE);
  if (!once.spread) throw new Error("analyzeStage returned no spread for a stage with tolerances");
  const ms = await timeRuns(() => analyzeStage(STAGE), RUNS, WARMUP);
  log(`engine: analyzeStage runs ms ${ms.map((x) => x.toFixed(1)).join(" ")}`);
  return {
    figures: [
      figure(
        "engine: analyzeStage, Monte Carlo",
        median(ms),
        "ms",
        { op: "<", value: 20 },
        `median of ${RUNS} after ${WARMUP} warm-up; ${DEFAULT_SAMPLES} samples; p90 ${percentile(ms, 90).toFixed(1)} ms`,
      ),
    ],
    details: { samples: DEFAULT_SAMPLES, runsMs: ms, periodS: once.periodS },
  };
}
