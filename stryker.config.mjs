// Mutation testing (issue 14): StrykerJS with its vitest runner and
// TypeScript checker over lib/engine, lib/bundle and lib/capture.
// scripts/mutation/run.sh runs one folder at a time (MUTATE_FOLDER) so a
// run fits a shared 2-core machine; MUTATE_FILES picks single files for the
// sampled CI run. Each run writes its own JSON report under
// reports/mutation/ and scripts/mutation/report.ts prints the score per folder.
import { readFileSync } from "node:fs";

const folder = process.env.MUTATE_FOLDER ?? "lib";
// Sampled run (scripts/mutation/sample.ts): MUTATE_PICKS names picks files (comma-separated);
// each picked mutant becomes a mutate range "file:line:col-line:col" (lines
// 1-based, columns 0-based, as Stryker reads them) and the sample-picks
// ignorer keeps the run to the picked nodes.
const picksFiles = process.env.MUTATE_PICKS?.split(",").filter(Boolean);
const pickRanges = picksFiles?.flatMap((f) =>
  JSON.parse(readFileSync(f, "utf8")).picks.map(
    ({ file, location: { start, end } }) =>
      `${file}:${start.line + 1}:${start.column}-${end.line + 1}:${end.column}`,
  ),
);
const files = process.env.MUTATE_FILES?.split(",").filter(Boolean);
const name = process.env.MUTATE_NAME ?? folder.replaceAll("/", "-");

const mutate = pickRanges ??
  files ?? [
    `${folder}/**/*.ts`,
    // lib/engine holds solver/ and devices/ as folders of their own; "lib/engine"
    // alone means the files directly in it and stages/.
    ...(folder === "lib/engine" ? ["!lib/engine/solver/**", "!lib/engine/devices/**"] : []),
  ];
if (!pickRanges && !files && folder === "lib")
  mutate.splice(0, 1, "lib/engine/**/*.ts", "lib/bundle/**/*.ts", "lib/capture/**/*.ts");

/** @type {import("@stryker-mutator/api/core").PartialStrykerOptions} */
const config = {
  testRunner: "vitest",
  vitest: { configFile: "vitest.mutation.config.mts" },
  checkers: ["typescript"],
  tsconfigFile: "tsconfig.mutation.json",
  typescriptChecker: { prioritizePerformanceOverAccuracy: true },
  mutate,
  ...(pickRanges && {
    plugins: ["@stryker-mutator/*", "./scripts/mutation/sample-ignorer.mjs"],
    ignorers: ["sample-picks"],
  }),
  coverageAnalysis: "perTest",
  // shared machine: 2 cores for eight engineers
  concurrency: Number(process.env.MUTATE_CONCURRENCY ?? 2),
  timeoutMS: 20_000,
  // the first full run of the judging tests on a busy shared machine takes
  // longer than Stryker's default 5 minutes
  dryRunTimeoutMinutes: 30,
  // a sampled run starts clean: an incremental file would carry results over
  incremental: !pickRanges,
  incrementalFile: `reports/mutation/${name}.incremental.json`,
  reporters: ["clear-text", "json", "progress"],
  jsonReporter: { fileName: `reports/mutation/${name}.json` },
  clearTextReporter: { allowColor: false, logTests: false, reportMutants: false },
  tempDirName: ".stryker-tmp",
  cleanTempDir: "always",
  ignorePatterns: [
    "app",
    "components",
    ".next*",
    ".data",
    "tests/browser",
    "tests/integration*",
    "reports",
    "bench-results.json",
  ],
  thresholds: { high: 85, low: 80, break: null },
};

export default config;
