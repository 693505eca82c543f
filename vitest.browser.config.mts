import { defineConfig } from "vitest/config";

// Browser tests: playwright-core drives Debian's chromium against a production
// server that scripts/test.sh has started. They run one file at a time because
// they share the server and the database.
export default defineConfig({
  resolve: {
    tsconfigPaths: true,
    // "server-only" throws outside a React Server bundle; tests import server modules directly.
    alias: { "server-only": new URL("./tests/setup/empty-module.ts", import.meta.url).pathname },
  },
  test: {
    include: ["tests/browser/**/*.test.ts"],
    environment: "node",
    testTimeout: 180_000,
    hookTimeout: 180_000,
    fileParallelism: false,
    // expect.poll re-reads the page until the assertion holds (no fixed
    // sleeps, no read straight after an action); pages on a shared 2-core
    // machine can take seconds, so wait up to 30 s.
    expect: { poll: { timeout: 30_000, interval: 100 } },
  },
});
