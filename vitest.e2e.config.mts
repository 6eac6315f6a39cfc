import { defineConfig } from "vitest/config";
import path from "node:path";

// Browser tests: the built app with the demo data, a worker, the outbox consumers and the search server,
// driven by Debian's Chromium through playwright-core. One file at a time: they share one app and one database.
export default defineConfig({
  resolve: {
    alias: {
      "@": path.resolve(import.meta.dirname),
      "server-only": path.resolve(import.meta.dirname, "tests/support/empty.ts"),
    },
  },
  test: {
    include: ["tests/e2e/**/*.e2e.test.ts"],
    environment: "node",
    testTimeout: 180_000,
    hookTimeout: 600_000,
    pool: "forks",
    fileParallelism: false,
    globalSetup: ["tests/support/global-setup.ts", "tests/e2e/global-setup.ts"],
    setupFiles: ["tests/support/setup-env.ts"],
  },
});
