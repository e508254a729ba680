import { defineConfig } from "vitest/config";

// Browser end-to-end tests against a running app; `npm test` starts the app and sets
// E2E_BASE_URL, E2E_MAILDEV_URL, E2E_DATABASE_URL and CHROMIUM_PATH.
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    include: ["tests/e2e/**/*.e2e.ts"],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    // One browser at a time: the machine has two cores and the tests share one app.
    fileParallelism: false,
    pool: "forks",
  },
});
