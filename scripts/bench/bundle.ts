// Bundle part: files and zip of a six-device bundle, and its sha256 across runs.
import { analyzeStage } from "@/lib/engine";
import { buildBundleSources, sha256Hex, zipBundle } from "@/lib/bundle";
import { figure } from "./figures";
import { median, percentile } from "./stats";
import { sixDeviceSpec, STAGE } from "./workload";

const WARMUP = 3;
const RUNS = 15;

export async function bundlePart(log: (s: string) => void) {
  const a = analyzeStage(STAGE);
  const spec = sixDeviceSpec(a.periodS, a.highS);
  const total: number[] = [];
  const files: number[] = [];
  const hashes = new Set<string>();
  let bytes = 0;
  let fileCount = 0;
  for (let i = 0; i < WARMUP + RUNS; i++) {
    const t0 = performance.now();
    const built = buildBundleSources(spec);
    const t1 = performance.now();
    const zip = await zipBundle(built);
    const t2 = performance.now();
    hashes.add(sha256Hex(zip));
    bytes = zip.byteLength;
    fileCount = built.length;
    if (i < WARMUP) continue;
    files.push(t1 - t0);
    total.push(t2 - t0);
  }
  const zipMs = total.map((t, i) => t - files[i]);
  log(`bundle: files median ${median(files).toFixed(1)} ms, zip median ${median(zipMs).toFixed(1)} ms`);
  return {
    figures: [
      figure(
        "bundle: 6 devices, files + zip",
        median(total),
        "ms",
        { op: "<", value: 30 },
        `median of ${RUNS}; files ${median(files).toFixed(1)} ms, zip ${median(zipMs).toFixed(1)} ms; p90 ${percentile(total, 90).toFixed(1)} ms`,
      ),
      figure(
        "bundle: distinct sha256 over runs",
        hashes.size,
        "",
        { op: "=", value: 1 },
        `${WARMUP + RUNS} runs, ${fileCount} files, ${bytes} bytes`,
      ),
    ],
    details: { filesMs: files, totalMs: total, sha256: [...hashes], fileCount, bytes },
  };
}
