/**
 * npm start — the whole product on this machine: PostgreSQL (installed and initialised on first
 * run, data kept in .data/), migrations, demo data, the maildev mail catcher, the background
 * worker when present, and the production server (scripts/serve.ts). Ctrl-C stops everything
 * this script started.
 */
import { DEMO_PEOPLE } from "../seeds/demo-data";
import { runLocalStack } from "./lib/local-stack";
import { buildApp, buildIsStale, startAppServer } from "./lib/services";

runLocalStack({
  label: "start",
  nodeEnv: "production",
  prepare: () => {
    if (buildIsStale()) buildApp();
  },
  startApp: (env, childEnv) => startAppServer(childEnv, env.host, env.port),
  announce: (env) =>
    console.log(
      [
        "",
        "Stillpoint is running.",
        `  App        http://${env.host}:${env.port}`,
        `  Mail (web) ${env.maildevUrl}    SMTP 127.0.0.1:${env.smtp.port}`,
        `  Database   ${env.databaseUrl}    (cluster in ${env.pgClusterDir})`,
        `  Demo sign-in addresses: ${DEMO_PEOPLE.map((p) => p.email).join(", ")}`,
        "  (sign-in codes arrive in the mail web UI)",
        "Press Ctrl-C to stop.",
        "",
      ].join("\n"),
    ),
});
