import { defineConfig } from "vitest/config";

// Separate from vite.config.ts so unit tests never load the React Router plugin.
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    include: ["tests/**/*.test.ts"],
    exclude: ["tests/e2e/**", "node_modules/**"],
    // A console.error during a test fails it (tests/support/console-errors.ts).
    setupFiles: ["tests/support/console-errors.ts"],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    pool: "forks",
  },
});
