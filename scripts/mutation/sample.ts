// Draws the sampled mutation run: a seeded uniform random sample of mutants
// per folder from the full list (scripts/mutation/list-mutants.ts), without
// replacement, so the killed fraction of the sample is an unbiased estimate of
// the folder's. Writes reports/mutation/picks-<folder>.json, which
// stryker.config.mjs reads through MUTATE_PICKS (a mutate range per picked
// mutant, plus scripts/mutation/sample-ignorer.mjs for what else falls inside).
//   npx tsx scripts/mutation/sample.ts <folder> [size=60] [seed=14]
import { readFileSync, writeFileSync } from "node:fs";
import type { ListedMutant } from "./list-mutants";
import { FOLDERS, folderOf } from "./folders";

const [folder, sizeArg = "60", seedArg = "14"] = process.argv.slice(2);
if (!FOLDERS.some((f) => f.folder === folder)) {
  console.error(`folder must be one of: ${FOLDERS.map((f) => f.folder).join(", ")}`);
  process.exit(2);
}
const size = Number(sizeArg);
const seed = Number(seedArg);
if (!Number.isInteger(size) || size < 1 || !Number.isInteger(seed)) {
  console.error("size must be a whole number >= 1 and seed a whole number");
  process.exit(2);
}

const all: ListedMutant[] = JSON.parse(readFileSync("reports/mutation/all-mutants.json", "utf8"));
const population = all.filter((m) => folderOf(m.file)?.folder === folder);

// mulberry32: a small 32-bit seeded generator (common practice, no source);
// its output only has to be reproducible and uniform enough for a draw.
function mulberry32(a: number) {
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
// partial Fisher-Yates shuffle: the first `size` entries are a uniform sample without replacement
const rand = mulberry32(seed);
const order = population.map((_, i) => i);
const n = Math.min(size, order.length);
for (let i = 0; i < n; i++) {
  const j = i + Math.floor(rand() * (order.length - i));
  [order[i], order[j]] = [order[j], order[i]];
}
const picks = order.slice(0, n).map((i) => population[i]);
const name = folder.replaceAll("/", "-");
const out = `reports/mutation/picks-${name}.json`;
writeFileSync(out, JSON.stringify({ folder, population: population.length, seed, picks }, null, 1));
console.log(`${folder}: ${n} of ${population.length} mutants (seed ${seed}) -> ${out}`);
