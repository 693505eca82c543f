import { defineConfig } from "vitest/config";

// The unit tests that judge lib/engine, lib/bundle and lib/capture, for the
// mutation runs (stryker.config.mjs). Left out: tests that start external
// tools per run (ngspice, simavr, the cross compilers) or stream a million
// samples; each mutant would pay seconds for them, and the mutation figure is
// about what the fast pure tests catch. The tool tests still run in the
// normal suite.
export default defineConfig({
  resolve: {
    tsconfigPaths: true,
    alias: { "server-only": new URL("./tests/setup/empty-module.ts", import.meta.url).pathname },
  },
  test: {
    // MUTATE_TESTS (comma-separated globs) narrows the judging tests for a
    // run on one file: a mutant killed by the narrow set is killed by the
    // whole suite too, so the figure is a lower bound of the full one.
    include: process.env.MUTATE_TESTS?.split(",").filter(Boolean) ?? [
      "tests/unit/engine/**/*.test.ts",
      "tests/unit/bundle/**/*.test.ts",
      "tests/unit/capture/**/*.test.ts",
      "tests/unit/fuzz/**/*.test.ts",
    ],
    exclude: [
      "**/ngspice-*.test.ts",
      "**/simavr.test.ts",
      "**/toolchains.test.ts",
      "**/million-samples.test.ts",
      "**/time-zone.test.ts",
      "**/node_modules/**",
    ],
    setupFiles: ["tests/setup/seed.ts"],
    environment: "node",
    testTimeout: 60_000,
  },
});
