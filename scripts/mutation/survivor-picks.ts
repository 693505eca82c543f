// Writes the picks of a sampled run that did not die (survived, not covered,
// or missing) to reports/mutation/picks-rerun-<folder>.json, so they can be
// run again alone after new tests: bash scripts/mutation/run.sh --rerun <folder>
import { readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import type { ListedMutant } from "./list-mutants";
import { fromReportLocation, mutantKey, type MutantLocation } from "./mutant-key";

const folder = process.argv[2];
if (!folder) {
  console.error("usage: npx tsx scripts/mutation/survivor-picks.ts <folder>");
  process.exit(2);
}
const name = folder.replaceAll("/", "-");
const picksFile = `reports/mutation/picks-${name}.json`;
const { picks, ...rest } = JSON.parse(readFileSync(picksFile, "utf8")) as { picks: ListedMutant[] };
const report = JSON.parse(readFileSync(`reports/mutation/sampled-${name}.json`, "utf8")) as {
  files: Record<
    string,
    {
      mutants: {
        mutatorName: string;
        replacement?: string;
        status: string;
        location: MutantLocation;
      }[];
    }
  >;
};
const dead = new Set<string>();
for (const [file, { mutants }] of Object.entries(report.files))
  for (const m of mutants)
    if (m.status === "Killed" || m.status === "Timeout" || m.status === "CompileError")
      dead.add(mutantKey(path.normalize(file), m.mutatorName, m.replacement, fromReportLocation(m.location)));
const again = picks.filter((p) => !dead.has(p.key));
const out = `reports/mutation/picks-rerun-${name}.json`;
writeFileSync(out, JSON.stringify({ ...rest, picks: again }, null, 1));
console.log(`${again.length} of ${picks.length} picks to run again -> ${out}`);
