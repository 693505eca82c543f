import { defineConfig } from "vitest/config";

// Tests that disturb shared services (the PostgreSQL restart of the fault test)
// or read the server log after everything else: one file at a time, after the
// main run (scripts/test.sh).
export default defineConfig({
  resolve: {
    tsconfigPaths: true,
    alias: { "server-only": new URL("./tests/setup/empty-module.ts", import.meta.url).pathname },
  },
  test: {
    include: ["tests/integration-serial/**/*.test.ts"],
    environment: "node",
    testTimeout: 240_000,
    hookTimeout: 120_000,
    fileParallelism: false,
  },
});
