// Lists every mutant StrykerJS would make in lib/engine, lib/bundle and
// lib/capture, without running a test: the same instrumenter Stryker's core
// calls (@stryker-mutator/instrumenter, default mutators, no ignorers), so the
// list is the population the sampled run draws from (scripts/mutation/sample.ts).
//   npx tsx scripts/mutation/list-mutants.ts [out.json]   (default reports/mutation/all-mutants.json)
// Positions are Stryker's internal ones: lines and columns 0-based.
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { Instrumenter } from "@stryker-mutator/instrumenter";
import { mutantKey } from "./mutant-key";

export interface ListedMutant {
  /** file:line:column:mutator:replacement, stable while the source does not change */
  key: string;
  file: string;
  mutatorName: string;
  replacement: string;
  location: { start: { line: number; column: number }; end: { line: number; column: number } };
}

const out = process.argv[2] ?? "reports/mutation/all-mutants.json";
const files = ["lib/engine", "lib/bundle", "lib/capture"]
  .flatMap((d) => readdirSync(d, { recursive: true, encoding: "utf8" }).map((f) => path.join(d, f)))
  .filter((f) => f.endsWith(".ts"))
  .filter((f) => !f.endsWith(".d.ts"))
  .sort();

const quiet = { isDebugEnabled: () => false, debug() {}, info() {}, warn() {}, error() {} };
// eslint-disable-next-line @typescript-eslint/no-explicit-any
const instrumenter = new Instrumenter(quiet as any);
const result = await instrumenter.instrument(
  files.map((name) => ({ name, mutate: true, content: readFileSync(name, "utf8") })),
  { ignorers: [], plugins: null, excludedMutations: [] },
);
const mutants: ListedMutant[] = result.mutants
  .filter((m) => m.status !== "Ignored")
  .map((m) => ({
    key: mutantKey(path.normalize(m.fileName), m.mutatorName, m.replacement, m.location),
    file: path.normalize(m.fileName),
    mutatorName: m.mutatorName,
    replacement: m.replacement,
    location: m.location,
  }));
mkdirSync(path.dirname(out), { recursive: true });
writeFileSync(out, JSON.stringify(mutants, null, 1));
console.log(`${mutants.length} mutants in ${files.length} files -> ${out}`);
