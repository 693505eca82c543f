// Capture part: a 1 000 000-sample scope export measured by measureCsv in a
// child process (time and peak RSS), three runs, median time and worst RSS.
import { execFileSync } from "node:child_process";
import { createWriteStream, existsSync, mkdirSync, renameSync, statSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { once } from "node:events";
import { seededRandom } from "@/lib/engine";
import { figure } from "./figures";
import { median } from "./stats";

const SAMPLES = 1_000_000;
const RUNS = 3;
const FILE = path.join(os.tmpdir(), "clockgraft-bench", `capture-${SAMPLES}-v1.csv`);

/**
 * Demo data: a 1 MS/s record of a 2 kHz pulse train (60 us high, 5-sample
 * edges, 0.2 V / 4.8 V) with +-20 mV of uniform noise, times in seconds.
 */
export async function writeCapture(file: string, samples: number): Promise<void> {
  mkdirSync(path.dirname(file), { recursive: true });
  const partial = `${file}.part`;
  const out = createWriteStream(partial);
  const rand = seededRandom(181);
  const level = (k: number) => {
    const p = k % 500;
    if (p < 5) return 0.2 + (4.6 * p) / 5;
    if (p < 65) return 4.8;
    if (p < 70) return 4.8 - (4.6 * (p - 65)) / 5;
    return 0.2;
  };
  out.write("Record length,1000000\nSample interval,1e-06\nTime (s),CH1 (V)\n");
  let chunk: string[] = [];
  for (let i = 0; i < samples; i++) {
    chunk.push(`${(i * 1e-6).toExponential(6)},${(level(i + 250) + 0.04 * (rand() - 0.5)).toFixed(4)}`);
    if (chunk.length === 10_000 || i === samples - 1) {
      if (!out.write(chunk.join("\n") + "\n")) await once(out, "drain");
      chunk = [];
    }
  }
  out.end();
  await once(out, "finish");
  renameSync(partial, file);
}

interface ChildResult {
  ms: number;
  baseRssKb: number;
  maxRssKb: number;
  samples: number;
  periodS: number;
  duty: number;
}

export function measureInChild(file: string): ChildResult {
  const stdout = execFileSync(process.execPath, ["--import", "tsx", "scripts/bench/capture-child.ts", file], {
    encoding: "utf8",
    timeout: 120_000,
  });
  return JSON.parse(stdout.trim().split("\n").pop()!) as ChildResult;
}

export async function capturePart(log: (s: string) => void) {
  if (!existsSync(FILE)) await writeCapture(FILE, SAMPLES);
  const runs: ChildResult[] = [];
  for (let i = 0; i < RUNS; i++) runs.push(measureInChild(FILE));
  const r = runs[0];
  if (r.samples !== SAMPLES) throw new Error(`measureCsv counted ${r.samples} samples, expected ${SAMPLES}`);
  const ms = median(runs.map((x) => x.ms));
  // maxRSS is in KiB; the target is in MB (10^6 bytes).
  const peakMb = (Math.max(...runs.map((x) => x.maxRssKb)) * 1024) / 1e6;
  const baseMb = (Math.min(...runs.map((x) => x.baseRssKb)) * 1024) / 1e6;
  log(
    `capture: runs ms ${runs.map((x) => x.ms.toFixed(0)).join(" ")}; period ${r.periodS} s, duty ${r.duty}`,
  );
  const mb = (statSync(FILE).size / 1e6).toFixed(1);
  return {
    figures: [
      figure(
        "capture: 1M samples, time",
        ms,
        "ms",
        { op: "<", value: 1500 },
        `median of ${RUNS}, ${mb} MB CSV`,
      ),
      figure(
        "capture: 1M samples, peak RSS",
        peakMb,
        "MB",
        { op: "<", value: 300 },
        `whole child process; ${baseMb.toFixed(0)} MB before reading`,
      ),
    ],
    details: { file: FILE, runs },
  };
}
