import { defineConfig } from "vitest/config";

// Unit and integration tests. Integration tests talk to the PostgreSQL that
// scripts/test.sh starts (DATABASE_URL points at its own test database).
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    include: ["tests/unit/**/*.test.ts", "tests/integration/**/*.test.ts"],
    environment: "node",
    testTimeout: 60_000,
    hookTimeout: 120_000,
    fileParallelism: true,
  },
});
