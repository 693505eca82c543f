// Runs the benchmark parts in turn, prints the table and writes
// bench-results.json. Parts: solver, adversarial, engine, bundle, capture, capture-plot, pages, api, queue.
//   npx tsx scripts/bench/main.ts [--only=solver,engine]
// The api, pages and queue parts need the production server and build that
// scripts/bench.sh starts (BENCH_BASE_URL, NEXT_DIST_DIR).
import { writeFileSync } from "node:fs";
import os from "node:os";
import { formatTable, skipped, type Figure } from "./figures";

type PartResult = { figures: Figure[]; details?: unknown };
type Part = (log: (s: string) => void) => Promise<PartResult>;

const PARTS: Record<string, () => Promise<Part>> = {
  solver: async () => (await import("./solver")).solverPart,
  adversarial: async () => (await import("./adversarial")).adversarialPart,
  engine: async () => (await import("./engine")).enginePart,
  bundle: async () => (await import("./bundle")).bundlePart,
  images: async () => (await import("./images")).imagesPart,
  capture: async () => (await import("./capture")).capturePart,
  "capture-plot": async () => (await import("./capture-plot")).capturePlotPart,
  pages: async () => (await import("./pages")).pagesPart,
  api: async () => (await import("./api")).apiPart,
  queue: async () => (await import("./queue")).queuePart,
};

const log = (s: string) => process.stderr.write(`  ${s}\n`);

async function main() {
  const only = process.argv.find((a) => a.startsWith("--only="))?.slice(7);
  const names = only ? only.split(",") : Object.keys(PARTS);
  const figures: Figure[] = [];
  const details: Record<string, unknown> = {};
  for (const name of names) {
    if (!PARTS[name]) throw new Error(`no bench part "${name}" (parts: ${Object.keys(PARTS).join(", ")})`);
    log(`== ${name}`);
    const t0 = performance.now();
    try {
      const part = await PARTS[name]();
      const r = await part(log);
      figures.push(...r.figures);
      details[name] = r.details;
    } catch (e) {
      const why = e instanceof Error ? e.message.split("\n")[0] : String(e);
      figures.push(skipped(`${name}: failed`, why));
      details[name] = { error: e instanceof Error ? e.stack : String(e) };
    }
    log(`${name} took ${((performance.now() - t0) / 1000).toFixed(1)} s`);
  }
  const table = formatTable(figures);
  process.stdout.write(`\n${table}\n`);
  const out = {
    when: new Date().toISOString(),
    node: process.version,
    cpus: os.cpus().length,
    loadAverage: os.loadavg(),
    figures,
    details,
  };
  writeFileSync("bench-results.json", JSON.stringify(out, null, 2) + "\n");
  const missed = figures.filter((f) => f.status === "MISS").length;
  process.stdout.write(
    `\n${figures.length} figures, ${missed} missed their target; details in bench-results.json\n`,
  );
}

await main();
// The database pool (api part) would keep the process alive.
process.exit(0);
