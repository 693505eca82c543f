// Child process of the capture-plot part: one way of answering a zoomed plot
// request, timed over several windows, with the process's peak RSS.
//   node --import tsx scripts/bench/capture-plot-child.ts reparse FILE
//     (what the plot route did before the stored levels: the stored file is
//      parsed again for every window, then the window is decimated)
//   node --import tsx scripts/bench/capture-plot-child.ts levels CAPTURE_ID
//     (the route now: readWindow from capture_levels)
// Prints {msPerWindow: number[], baseRssKb, maxRssKb} as JSON.
import { readFileSync } from "node:fs";
import { decimateEnvelope, parseCapture, PLOT_POINTS } from "@/lib/capture";
import { readWindow } from "@/lib/field/capture-levels";
import { WINDOWS } from "./capture-plot-windows";

const [how, arg] = process.argv.slice(2);
const baseRssKb = process.resourceUsage().maxRSS;
const msPerWindow: number[] = [];

function lowerBound(t: Float64Array, x: number): number {
  let lo = 0;
  let hi = t.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (t[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

if (how === "reparse") {
  const content = readFileSync(arg); // stands for the bytea read of the old route
  for (const [fromS, toS] of WINDOWS) {
    const t0 = performance.now();
    const trace = await parseCapture(
      (async function* () {
        yield content;
      })(),
      { maxBytes: content.length + 1 },
    );
    const from = Math.max(0, lowerBound(trace.t, fromS) - 1);
    const to = Math.min(trace.t.length, lowerBound(trace.t, toS) + 1);
    decimateEnvelope(trace.t, trace.v, PLOT_POINTS, from, to);
    msPerWindow.push(performance.now() - t0);
  }
} else if (how === "levels") {
  for (const [fromS, toS] of WINDOWS) {
    const t0 = performance.now();
    const w = await readWindow(Number(arg), fromS, toS);
    if (w.points.length === 0) throw new Error(`no points for ${fromS}..${toS}`);
    msPerWindow.push(performance.now() - t0);
  }
} else throw new Error("usage: capture-plot-child.ts reparse FILE | levels CAPTURE_ID");
process.stdout.write(
  JSON.stringify({ msPerWindow, baseRssKb, maxRssKb: process.resourceUsage().maxRSS }) + "\n",
);
process.exit(0);
