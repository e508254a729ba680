/**
 * npm start — the whole product on this machine: PostgreSQL (installed and initialised on first
 * run, data kept in .data/), migrations, demo data, the maildev mail catcher, the background
 * worker when present, and the production server. Ctrl-C stops everything this script started.
 */
import { getEnv } from "../app/env.server";
import { startLocalDatabase } from "./db/local";
import { log } from "./lib/log";
import { type Managed, onShutdown } from "./lib/processes";
import { assertPortsFree, buildApp, buildIsStale, startAppServer, startMaildev, startWorkerIfPresent } from "./lib/services";
import { migrate } from "./migrate";
import { seed } from "./seed";
import { DEMO_PEOPLE } from "../seeds/demo-data";

const env = getEnv();
const children: Managed[] = [];
let database: { stop(): void } | undefined;
let stopping = false;

const shutdown = onShutdown(async () => {
  stopping = true;
  log("start", "stopping…");
  for (const child of [...children].reverse()) await child.stop();
  database?.stop();
  log("start", "everything stopped");
});

async function main() {
  await assertPortsFree({ app: env.port, "maildev SMTP": env.smtp.port, "maildev web": env.maildevWebPort });
  database = await startLocalDatabase(env);
  await migrate(env.databaseUrl);
  await seed(env.databaseUrl);

  children.push(await startMaildev(env.smtp.port, env.maildevWebPort));
  log("mail", `maildev: web UI ${env.maildevUrl} · SMTP 127.0.0.1:${env.smtp.port}`);

  if (buildIsStale()) buildApp();
  const childEnv = { ...process.env, DATABASE_URL: env.databaseUrl, NODE_ENV: "production" };
  const worker = startWorkerIfPresent(childEnv);
  if (worker) children.push(worker);
  children.push(await startAppServer(childEnv, env.host, env.port));

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
  );

  // If a child dies on its own, stop the rest rather than limp along.
  const first = await Promise.race(children.map((c) => c.exited.then((code) => ({ c, code }))));
  if (stopping) return;
  log("start", `${first.c.name} exited (code ${first.code}); stopping the rest`);
  await shutdown();
  process.exit(1);
}

main().catch(async (err) => {
  console.error(`[start] ${err instanceof Error ? err.message : err}`);
  await shutdown();
  process.exit(1);
});
