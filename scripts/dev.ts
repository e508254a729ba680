/**
 * npm run dev — like npm start, but the app runs under `react-router dev` with hot reload.
 * Same database, migrations, demo data and mail catcher. Ctrl-C stops everything.
 */
import path from "node:path";
import { getEnv } from "../app/env.server";
import { startLocalDatabase } from "./db/local";
import { log } from "./lib/log";
import { type Managed, onShutdown, startProcess } from "./lib/processes";
import { assertPortsFree, startMaildev, startWorkerIfPresent } from "./lib/services";
import { migrate } from "./migrate";
import { seed } from "./seed";

const env = getEnv();
const children: Managed[] = [];
let database: { stop(): void } | undefined;
let stopping = false;

const shutdown = onShutdown(async () => {
  stopping = true;
  log("dev", "stopping…");
  for (const child of [...children].reverse()) await child.stop();
  database?.stop();
  log("dev", "everything stopped");
});

async function main() {
  await assertPortsFree({ app: env.port, "maildev SMTP": env.smtp.port, "maildev web": env.maildevWebPort });
  database = await startLocalDatabase(env);
  await migrate(env.databaseUrl);
  await seed(env.databaseUrl);
  children.push(await startMaildev(env.smtp.port, env.maildevWebPort));
  log("mail", `maildev: web UI ${env.maildevUrl} · SMTP 127.0.0.1:${env.smtp.port}`);

  const childEnv = { ...process.env, DATABASE_URL: env.databaseUrl, NODE_ENV: "development" };
  const worker = startWorkerIfPresent(childEnv);
  if (worker) children.push(worker);
  children.push(
    startProcess(
      "app",
      path.resolve("node_modules/.bin/react-router"),
      ["dev", "--host", env.host, "--port", String(env.port), "--strictPort"],
      { env: childEnv },
    ),
  );
  log("dev", `app with hot reload on http://${env.host}:${env.port} — Ctrl-C to stop`);
  const first = await Promise.race(children.map((c) => c.exited.then((code) => ({ c, code }))));
  if (stopping) return;
  log("dev", `${first.c.name} exited (code ${first.code}); stopping the rest`);
  await shutdown();
  process.exit(1);
}

main().catch(async (err) => {
  console.error(`[dev] ${err instanceof Error ? err.message : err}`);
  await shutdown();
  process.exit(1);
});
