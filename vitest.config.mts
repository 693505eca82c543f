import { defineConfig } from "vitest/config";

// Unit and integration tests. Integration tests talk to the PostgreSQL that
// scripts/test.sh starts (DATABASE_URL points at its own test database).
export default defineConfig({
  resolve: {
    tsconfigPaths: true,
    // "server-only" throws outside a React Server bundle; tests import server modules directly.
    alias: { "server-only": new URL("./tests/setup/empty-module.ts", import.meta.url).pathname },
  },
  test: {
    include: ["tests/unit/**/*.test.ts", "tests/integration/**/*.test.ts"],
    // fixed fast-check seed for every property (tests/setup/seed.ts)
    setupFiles: ["tests/setup/seed.ts"],
    environment: "node",
    testTimeout: 60_000,
    hookTimeout: 120_000,
    fileParallelism: true,
  },
});
