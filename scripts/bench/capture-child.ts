// Child process of the capture part: measures one CSV file with measureCsv
// and prints {ms, baseRssKb, maxRssKb, samples, periodS} as JSON. Run alone so
// the peak RSS is the capture's own, not the benchmark runner's.
//   node --import tsx scripts/bench/capture-child.ts FILE
import { createReadStream } from "node:fs";
import { measureCsv } from "@/lib/capture";

const file = process.argv[2];
if (!file) throw new Error("usage: capture-child.ts FILE");
const baseRssKb = process.resourceUsage().maxRSS;
const t0 = performance.now();
const m = await measureCsv(createReadStream(file, { highWaterMark: 1 << 16 }), {
  maxBytes: 256 * 1024 * 1024,
});
const ms = performance.now() - t0;
const maxRssKb = process.resourceUsage().maxRSS;
process.stdout.write(
  JSON.stringify({ ms, baseRssKb, maxRssKb, samples: m.samples, periodS: m.periodS.mean, duty: m.duty }) +
    "\n",
);
