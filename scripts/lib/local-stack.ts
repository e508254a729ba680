/**
 * What `npm start` and `npm run dev` share: PostgreSQL (installed and initialised on first run),
 * migrations, demo data, maildev and the background worker, then the app server the caller
 * starts; Ctrl-C stops everything this process started, in reverse order. A child that dies on
 * its own (the worker, the app server, maildev) is restarted (scripts/lib/supervisor.ts); only
 * one that keeps crashing makes the rest stop, rather than limp along.
 */
import { existsSync } from "node:fs";
import path from "node:path";
import { type Env, getEnv } from "../../app/env.server";
import { startLocalDatabase } from "../db/local";
import { migrate } from "../migrate";
import { seed } from "../seed";
import { log } from "./log";
import { type Managed, onShutdown } from "./processes";
import { assertPortsFree, startMaildev, startWorkerIfPresent } from "./services";
import { supervise } from "./supervisor";

export interface LocalStackOptions {
  /** Tag for log lines: "start" or "dev". */
  label: string;
  nodeEnv: "production" | "development";
  /** Runs before the worker and the app start (e.g. a build). */
  prepare?: () => void;
  /** Starts the app server and resolves once it answers. */
  startApp: (env: Env, childEnv: NodeJS.ProcessEnv) => Promise<Managed> | Managed;
  /** What to print once everything runs. */
  announce: (env: Env) => void;
}

export function runLocalStack(options: LocalStackOptions): void {
  const { label } = options;
  const env = getEnv();
  const children: Managed[] = [];
  let database: { stop(): void } | undefined;
  let stopping = false;

  const shutdown = onShutdown(async () => {
    stopping = true;
    log(label, "stopping…");
    for (const child of [...children].reverse()) await child.stop();
    database?.stop();
    log(label, "everything stopped");
  });

  async function main() {
    await assertPortsFree({ app: env.port, "maildev SMTP": env.smtp.port, "maildev web": env.maildevWebPort });
    database = await startLocalDatabase(env);
    await migrate(env.databaseUrl);
    await seed(env.databaseUrl);
    children.push(await supervise("mail", () => startMaildev(env.smtp.port, env.maildevWebPort)));
    log("mail", `maildev: web UI ${env.maildevUrl} · SMTP 127.0.0.1:${env.smtp.port}`);

    options.prepare?.();
    const childEnv = { ...process.env, DATABASE_URL: env.databaseUrl, NODE_ENV: options.nodeEnv };
    if (existsSync(path.resolve("app/jobs/worker.server.ts"))) {
      children.push(await supervise("worker", () => startWorkerIfPresent(childEnv)!));
    }
    children.push(await supervise("app", () => options.startApp(env, childEnv)));
    options.announce(env);

    const first = await Promise.race(children.map((c) => c.exited.then((code) => ({ c, code }))));
    if (stopping) return;
    log(label, `${first.c.name} keeps exiting (last code ${first.code}); stopping the rest`);
    await shutdown();
    process.exit(1);
  }

  main().catch(async (err) => {
    console.error(`[${label}] ${err instanceof Error ? err.message : err}`);
    await shutdown();
    process.exit(1);
  });
}
