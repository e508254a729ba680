/** The pieces `npm start`, `npm run dev` and `npm test` bring up besides the database. */
import { spawnSync } from "node:child_process";
import { existsSync, readdirSync, statSync } from "node:fs";
import path from "node:path";
import { portIsFree } from "../db/postgres";
import { log } from "./log";
import { type Managed, startProcess, waitForHttp } from "./processes";

const bin = (name: string) => path.resolve("node_modules", ".bin", name);

export async function assertPortsFree(ports: Record<string, number>) {
  for (const [what, port] of Object.entries(ports)) {
    if (!(await portIsFree(port))) {
      throw new Error(`port ${port} on 127.0.0.1 (${what}) is already in use; stop that program or choose another port`);
    }
  }
}

/** maildev on loopback only: SMTP for the app, a web UI and REST API for people and tests. */
export async function startMaildev(smtpPort: number, webPort: number, options: { quiet?: boolean } = {}) {
  const p = startProcess(
    "maildev",
    bin("maildev"),
    ["--ip", "127.0.0.1", "--web-ip", "127.0.0.1", "-s", String(smtpPort), "-w", String(webPort)],
    { quiet: options.quiet ?? true },
  );
  await waitForHttp(`http://127.0.0.1:${webPort}/api/healthz`, { process: p, timeoutMs: 60_000 });
  return p;
}

const BUILD_INPUTS = ["app", "domain", "migrations", "package.json", "vite.config.ts", "react-router.config.ts"];

function newestMtime(target: string): number {
  if (!existsSync(target)) return 0;
  const st = statSync(target);
  if (!st.isDirectory()) return st.mtimeMs;
  let newest = st.mtimeMs;
  for (const entry of readdirSync(target)) newest = Math.max(newest, newestMtime(path.join(target, entry)));
  return newest;
}

/** True when build/ is missing or older than any source it is made from. */
export function buildIsStale(): boolean {
  const output = path.resolve("build/server/index.js");
  if (!existsSync(output)) return true;
  const built = statSync(output).mtimeMs;
  return BUILD_INPUTS.some((input) => newestMtime(path.resolve(input)) > built);
}

/** react-router build into `buildDir` (default build/); returns the server entry to serve. */
export function buildApp(buildDir = "build", options: { quiet?: boolean } = {}): string {
  log("build", `building the app into ${buildDir}/ (react-router build)`);
  const res = spawnSync(bin("react-router"), ["build"], {
    stdio: options.quiet ? "pipe" : "inherit",
    encoding: "utf8",
    env: { ...process.env, NODE_ENV: "production", STILLPOINT_BUILD_DIR: buildDir },
  });
  if (res.status !== 0) throw new Error(`react-router build failed${options.quiet ? `:\n${res.stdout}\n${res.stderr}` : ""}`);
  return path.join(buildDir, "server", "index.js");
}

/** The production server (scripts/serve.ts: like react-router-serve, plus the client address) on `host`:`port`. */
export async function startAppServer(
  env: NodeJS.ProcessEnv,
  host: string,
  port: number,
  options: { quiet?: boolean; serverEntry?: string } = {},
) {
  const p = startProcess("app", bin("tsx"), ["scripts/serve.ts", options.serverEntry ?? "build/server/index.js"], {
    env: { ...env, NODE_ENV: "production", HOST: host, PORT: String(port) },
    quiet: options.quiet,
  });
  await waitForHttp(`http://${host}:${port}/api/health`, { process: p, timeoutMs: 60_000, accept: () => true });
  return p;
}

/** The background worker, once the analyses module adds it (app/jobs/worker.server.ts). */
export function startWorkerIfPresent(env: NodeJS.ProcessEnv, options: { quiet?: boolean } = {}): Managed | undefined {
  if (!existsSync(path.resolve("app/jobs/worker.server.ts"))) return undefined;
  log("worker", "starting the background worker (npm run worker)");
  return startProcess("worker", bin("tsx"), ["app/jobs/worker.server.ts"], { env, quiet: options.quiet });
}
