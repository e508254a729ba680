import type { Config } from "@react-router/dev/config";

export default {
  appDirectory: "app",
  // `npm test` builds into its own folder (test-results/builds/<pid>) so parallel runs never share one.
  buildDirectory: process.env.STILLPOINT_BUILD_DIR ?? "build",
  ssr: true,
} satisfies Config;
