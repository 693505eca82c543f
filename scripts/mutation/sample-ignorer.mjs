// Stryker ignorer plugin for the sampled run (stryker.config.mjs, MUTATE_PICKS).
// Each picked mutant gets a mutate range equal to its node's location, but a
// range also takes in every mutant of the nodes inside it; this ignorer skips
// the nodes that neither are a picked node nor hold one, so only the picked
// nodes' own mutants run (other mutators on the same node run too and are
// reported apart; scripts/mutation/report.ts counts the picked ones only).
import { readFileSync } from "node:fs";
import path from "node:path";
import { PluginKind, declareValuePlugin } from "@stryker-mutator/api/plugin";

const picksFiles = process.env.MUTATE_PICKS?.split(",").filter(Boolean) ?? [];
/** file -> babel locations (lines 1-based, columns 0-based) of picked nodes */
const picked = new Map();
for (const f of picksFiles) {
  for (const m of JSON.parse(readFileSync(f, "utf8")).picks) {
    const { start, end } = m.location;
    const loc = {
      start: { line: start.line + 1, column: start.column },
      end: { line: end.line + 1, column: end.column },
    };
    picked.set(m.file, [...(picked.get(m.file) ?? []), loc]);
  }
}

const before = (a, b) => a.line < b.line || (a.line === b.line && a.column <= b.column);
const same = (a, b) => a.line === b.line && a.column === b.column;
const holds = (outer, inner) => before(outer.start, inner.start) && before(inner.end, outer.end);

export const strykerPlugins = [
  declareValuePlugin(PluginKind.Ignore, "sample-picks", {
    shouldIgnore(nodePath) {
      const loc = nodePath.node.loc;
      const filename = nodePath.hub?.file?.opts?.filename;
      if (!loc || !filename) return undefined;
      const locs = picked.get(path.relative(process.cwd(), filename)) ?? [];
      const keep = locs.some((p) => (same(p.start, loc.start) && same(p.end, loc.end)) || holds(loc, p));
      return keep ? undefined : "not in the sample";
    },
  }),
];
