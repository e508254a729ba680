/**
 * npm run dev — like npm start, but the app runs under `react-router dev` with hot reload.
 * Same database, migrations, demo data, mail catcher and worker. Ctrl-C stops everything.
 */
import path from "node:path";
import { log } from "./lib/log";
import { runLocalStack } from "./lib/local-stack";
import { startProcess } from "./lib/processes";

runLocalStack({
  label: "dev",
  nodeEnv: "development",
  startApp: (env, childEnv) =>
    startProcess(
      "app",
      path.resolve("node_modules/.bin/react-router"),
      ["dev", "--host", env.host, "--port", String(env.port), "--strictPort"],
      { env: childEnv },
    ),
  announce: (env) => log("dev", `app with hot reload on http://${env.host}:${env.port} — Ctrl-C to stop`),
});
