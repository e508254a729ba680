/**
 * `npm run bench -- --load [--levels 50,200] [--seconds 20]`: the web app under load, on this
 * machine, over loopback. It starts its own throw-away PostgreSQL (scripts/db/postgres.ts), the
 * production build (rebuilt into its own folder when build/ is stale), the app server and one
 * worker (scripts/lib/services.ts), exactly as `npm start` runs them, and removes all of it at the
 * end. Then, for each level, that many signed-in users (each a lab member with a session of their
 * own) load the lab's network list, a network page and the network's JSON API route in a closed
 * loop (load-generator.ts), pausing `--think` ms (default 1000, a person reading) after each, while an analysis that is slow by construction keeps the worker busy,
 * one editor uploads a new network every half second and another submits an analysis every three
 * seconds. It prints latency percentiles, error counts and how often a request had to queue for a
 * database connection (the app's pool counters, DB_POOL_STATS=1), and writes
 * bench/results/load.json. Targets (issue 16 #12): at 50 users p95 under 300 ms with 0 errors on
 * the three reads; at 200 users 0 errors. Exit code 1 when a target is missed.
 */
import { randomBytes } from "node:crypto";
import http from "node:http";
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { cpus, loadavg, tmpdir } from "node:os";
import path from "node:path";
import { ensureDatabase, freePort, serverUrl, startThrowawayCluster } from "../scripts/db/postgres";
import type { Managed } from "../scripts/lib/processes";
import { buildApp, buildIsStale, startAppServer, startWorkerIfPresent } from "../scripts/lib/services";
import { webProcesses } from "../scripts/lib/web-cluster";
import { migrate } from "../scripts/migrate";
import { seed } from "../scripts/seed";
import { DEMO_LAB } from "../seeds/demo-data";
import type { PoolStats } from "../app/db.server";
import { closedLoop, makeTarget, send, type RouteSummary, type Step, summarise } from "./lib/load-generator";
import { busiestOthers, type CpuSnapshot, cpuSnapshot, machineCpuMs, treeCpuMs } from "./lib/process-cpu";

interface LoadOptions {
  levels: number[];
  seconds: number;
  /** Pause of each user between two page loads (a person reading); 0 makes it a saturation test. */
  thinkMs: number;
  /** Folder for the app server's V8 CPU profiles (node --cpu-prof), one per web process. */
  profileDir?: string;
  /** Only these reads (by position: list, page, api), to measure one route's cost alone. */
  reads: string[];
}

export const LOAD_USAGE = `npm run bench -- --load [--levels 50,200] [--seconds 20] [--think 1000] [--profile DIR] [--reads list,page,api]`;

function parseLoadOptions(argv: string[]): LoadOptions {
  const o: LoadOptions = { levels: [50, 200], seconds: 20, thinkMs: 1000, reads: ["list", "page", "api"] };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a === "--load") continue;
    const value = argv[++i];
    if (a === "--levels" && value && /^\d+(,\d+)*$/.test(value)) o.levels = value.split(",").map(Number);
    else if (a === "--seconds" && value && /^\d+$/.test(value) && Number(value) > 0) o.seconds = Number(value);
    else if (a === "--think" && value && /^\d+$/.test(value)) o.thinkMs = Number(value);
    else if (a === "--profile" && value) o.profileDir = path.resolve(value);
    else if (a === "--reads" && value && /^(list|page|api)(,(list|page|api))*$/.test(value)) o.reads = value.split(",");
    else throw new RangeError(`bench --load: unexpected "${a}${value === undefined ? "" : ` ${value}`}"\nusage: ${LOAD_USAGE}`);
  }
  return o;
}

const READS = ["network list", "network page", "network API"];

/** How many web processes the app runs with (WEB_PROCESSES as scripts/serve.ts reads it). */
let webProcessCount = 1;

export async function runLoad(argv: string[], root: string): Promise<number> {
  const o = parseLoadOptions(argv);
  const users = Math.max(...o.levels);
  const scratch = mkdtempSync(path.join(tmpdir(), "stillpoint-load-"));
  const children: Managed[] = [];
  let disposeDb: (() => void) | undefined;
  let buildDir: string | undefined;
  try {
    console.log(`machine: ${cpus().length} cores, ${cpus()[0]?.model ?? "unknown CPU"}; load average (1 min) ${loadavg()[0]!.toFixed(2)}`);
    const pg = await startThrowawayCluster();
    disposeDb = pg.dispose;
    await ensureDatabase(pg.port, "stillpoint_load");
    const databaseUrl = serverUrl(pg.port, "stillpoint_load");
    await migrate(databaseUrl);
    await seed(databaseUrl);

    const appPort = await freePort();
    const appUrl = `http://127.0.0.1:${appPort}`;
    const env: NodeJS.ProcessEnv = {
      ...process.env,
      NODE_ENV: "production",
      DATABASE_URL: databaseUrl,
      APP_URL: appUrl,
      DATA_DIR: path.join(scratch, "data"),
      SESSION_SECRET: randomBytes(32).toString("hex"),
      TOTP_SECRET: randomBytes(32).toString("hex"),
      // No mail is sent (no sign-in, notification off); a closed port just in case.
      SMTP_PORT: String(await freePort()),
      DB_POOL_STATS: "1",
    };
    const cookies = await signedInUsers(env, users);

    let serverEntry = path.join("build", "server", "index.js");
    if (buildIsStale()) {
      buildDir = path.join("test-results", "builds", `load-${process.pid}`);
      serverEntry = buildApp(buildDir, { quiet: true });
    }
    const worker = startWorkerIfPresent(env, { quiet: true });
    if (worker) children.push(worker);
    webProcessCount = webProcesses(env.WEB_PROCESSES);
    const appEnv = o.profileDir ? { ...env, CPU_PROFILE_DIR: o.profileDir } : env;
    const app = await startAppServer(appEnv, "127.0.0.1", appPort, { quiet: true, serverEntry });
    children.push(app);
    console.log(
      `app ${appUrl} (DB_POOL_MAX ${env.DB_POOL_MAX ?? "default"} per process, ${webProcessCount} web process${webProcessCount === 1 ? "" : "es"} (WEB_PROCESSES ${env.WEB_PROCESSES ?? "unset"})${o.profileDir ? `, CPU profiles into ${o.profileDir}` : ""}), worker ${worker ? "running" : "absent"}; ${users} signed-in users\n`,
    );
    const ours = { app: app.child.pid!, worker: worker?.child.pid, postgres: postmasterPid(pg.cluster.dataDir) };

    const lab = DEMO_LAB.slug;
    const control = makeTarget("127.0.0.1", appPort, 4, 60_000);
    const json = (cookie: string, body: unknown): Pick<Step, "headers" | "body"> => ({
      headers: { Cookie: cookie, "Content-Type": "application/json" },
      body: JSON.stringify(body),
    });
    const create = async (name: string, csv: string) => {
      const res = await fetchJson(control, { route: "setup", method: "POST", path: `/api/labs/${lab}/networks`, ...json(cookies[0]!, { name, csv }), ok: [201] });
      return (res as { network: { id: string } }).network.id;
    };
    const pageNetwork = await create("Two-site cycle (load bench)", readFileSync(path.join(root, "bench", "systems", "phospho-2site-symbolic.csv"), "utf8"));
    const slowNetwork = await create("Ten switches (load bench)", readFileSync(path.join(root, "tests", "fixtures", "networks", "ten-switches.csv"), "utf8"));
    const smallNetwork = await create("Small for submissions (load bench)", "reaction,rate,reverse_rate,rate_value,reverse_rate_value\nA <-> B,k1,k2,1,2\n");
    // The page under load shows its whole structure: wait until the worker has computed it.
    for (let i = 0; i < 120; i++) {
      const item = (await fetchJson(control, { route: "setup", path: `/api/labs/${lab}/networks/${pageNetwork}`, headers: { Cookie: cookies[0]! } })) as { structureStatus: string };
      if (item.structureStatus === "ready") break;
      await new Promise((r) => setTimeout(r, 250));
    }

    const readSteps = (cookie: string): Step[] =>
      [
        { key: "list", route: "network list", path: `/labs/${lab}/networks`, headers: { Cookie: cookie }, thinkMs: o.thinkMs },
        { key: "page", route: "network page", path: `/labs/${lab}/networks/${pageNetwork}`, headers: { Cookie: cookie }, thinkMs: o.thinkMs },
        { key: "api", route: "network API", path: `/api/labs/${lab}/networks/${pageNetwork}`, headers: { Cookie: cookie }, thinkMs: o.thinkMs },
      ]
        .filter((s) => o.reads.includes(s.key))
        .map(({ key: _key, ...step }) => step);
    await printRequestCosts(control, readSteps(cookies[0]!));

    const results: { users: number; rows: RouteSummary[]; pool: PoolDelta; db: { maxConnections: number }; cpu: CpuShares }[] = [];
    for (const level of o.levels) {
      // An analysis that is slow by construction runs for the whole phase.
      await fetchJson(control, { route: "setup", method: "POST", path: `/api/labs/${lab}/analyses`, ...json(cookies[0]!, { networkId: slowNetwork, timeLimitSeconds: o.seconds + 30 }), ok: [202] });
      await waitForRunning(control, lab, cookies[0]!);
      const poolBefore = await poolCounters(control);
      const target = makeTarget("127.0.0.1", appPort, level + 2);
      const dbSampler = sampleConnections(databaseUrl);
      const cpuBefore = cpuSnapshot();
      const selfBefore = process.cpuUsage();
      const [reads, uploads, submissions] = await Promise.all([
        closedLoop(target, level, o.seconds, (user) => readSteps(cookies[user]!)),
        closedLoop(target, 1, o.seconds, (_user, round) => [
          {
            route: "upload",
            method: "POST",
            path: `/api/labs/${lab}/networks`,
            ...json(cookies[0]!, { name: `Upload ${level}-${round}`, csv: `reaction,rate,reverse_rate,rate_value,reverse_rate_value\nA + B <-> C,k1,k2,${round + 1},3\nC -> D,k3,,1/${round + 2},\n` }),
            ok: [201],
            thinkMs: 500,
          },
        ]),
        closedLoop(target, 1, o.seconds, (_user, round) => [
          {
            route: "analysis submission",
            method: "POST",
            path: `/api/labs/${lab}/analyses`,
            ...json(cookies[1 + (round % 2)]!, { networkId: smallNetwork }),
            ok: [202],
            thinkMs: 3000,
          },
        ]),
      ]);
      const cpu = cpuShares(cpuBefore, cpuSnapshot(), process.cpuUsage(selfBefore), ours, reads.length + uploads.length + submissions.length);
      const db = await dbSampler.stop();
      const pool = delta(poolBefore, await poolCounters(control));
      const rows = summarise([...reads, ...uploads, ...submissions], o.seconds);
      results.push({ users: level, rows, pool, db, cpu });
      printLevel(level, o, rows, pool, db, cpu);
      target.agent.destroy();
      await cancelAll(control, lab, cookies[0]!);
    }

    const verdicts = results.map((r) => targetVerdict(r.users, r.rows));
    for (const v of verdicts) console.log(v.line);
    mkdirSync(path.join(root, "bench", "results"), { recursive: true });
    writeFileSync(
      path.join(root, "bench", "results", "load.json"),
      JSON.stringify({ generatedAt: new Date().toISOString(), machine: { cores: cpus().length, cpu: cpus()[0]?.model, node: process.version, loadAverageEnd: loadavg()[0] }, options: o, results }, null, 2) + "\n",
    );
    console.log("\nwritten: bench/results/load.json");
    control.agent.destroy();
    return verdicts.every((v) => v.met) ? 0 : 1;
  } finally {
    for (const child of [...children].reverse()) await child.stop();
    disposeDb?.();
    rmSync(scratch, { recursive: true, force: true });
    if (buildDir) rmSync(buildDir, { recursive: true, force: true });
  }
}

/**
 * `count` users, editors of the demo lab, each with a session cookie made by the app's own session
 * storage (so the app accepts it). Runs in this process with the app's settings.
 */
async function signedInUsers(env: NodeJS.ProcessEnv, count: number): Promise<string[]> {
  for (const key of ["DATABASE_URL", "SESSION_SECRET", "TOTP_SECRET", "APP_URL", "DATA_DIR", "NODE_ENV"]) process.env[key] = env[key];
  const { db, closeDb } = await import("../app/db.server");
  const { getSession, commitSession } = await import("../app/auth/session.server");
  const lab = await db().selectFrom("labs").select("id").where("slug", "=", DEMO_LAB.slug).executeTakeFirstOrThrow();
  const cookies: string[] = [];
  for (let i = 0; i < count; i++) {
    const user = await db()
      .insertInto("users")
      .values({ email: `load-${i}@bench.test`, display_name: `Load User ${i}` })
      .returning("id")
      .executeTakeFirstOrThrow();
    await db().insertInto("memberships").values({ lab_id: lab.id, user_id: user.id, role: "editor" }).execute();
    const session = await getSession(new Request(env.APP_URL!));
    session.set("userId", user.id);
    cookies.push((await commitSession(session)).split(";")[0]!);
  }
  await closeDb();
  return cookies;
}

async function fetchJson(target: ReturnType<typeof makeTarget>, step: Step): Promise<unknown> {
  const url = `http://${target.host}:${target.port}${step.path}`;
  const res = await fetch(url, { method: step.method ?? "GET", headers: step.headers, body: step.body });
  const text = await res.text();
  if (!(step.ok ?? [200]).includes(res.status)) throw new Error(`${step.method ?? "GET"} ${step.path}: ${res.status} ${text.slice(0, 300)}`);
  return JSON.parse(text);
}

interface Analysis {
  id: string;
  status: string;
  links: { cancel: string };
}

async function analyses(control: ReturnType<typeof makeTarget>, lab: string, cookie: string): Promise<Analysis[]> {
  const body = (await fetchJson(control, { route: "setup", path: `/api/labs/${lab}/analyses`, headers: { Cookie: cookie } })) as { analyses: Analysis[] };
  return body.analyses;
}

async function waitForRunning(control: ReturnType<typeof makeTarget>, lab: string, cookie: string) {
  for (let i = 0; i < 60; i++) {
    if ((await analyses(control, lab, cookie)).some((a) => a.status === "running")) return;
    await new Promise((r) => setTimeout(r, 500));
  }
  console.log("note: no analysis reached 'running' within 30 s (is the worker up?)");
}

async function cancelAll(control: ReturnType<typeof makeTarget>, lab: string, cookie: string) {
  for (const a of await analyses(control, lab, cookie)) {
    if (a.status !== "queued" && a.status !== "running") continue;
    await send(control, { route: "setup", method: "POST", path: a.links.cancel, headers: { Cookie: cookie, "Content-Type": "application/json" }, body: "{}" });
  }
}

/**
 * What one answer of each read costs before any load: its size as sent (gzip, as the generator
 * asks) and unpacked, and how many database queries it made (the app pool's acquisitions: one per
 * query outside a transaction; the counters' own /api/health calls are subtracted). Run it with
 * WEB_PROCESSES=1 for exact counts: with several processes the background (the worker's
 * submissions are not in it, but an app process's own timers are) can blur them.
 */
async function printRequestCosts(control: ReturnType<typeof makeTarget>, steps: Step[]) {
  const url = (p: string) => `http://${control.host}:${control.port}${p}`;
  const a = await poolCounters(control);
  const b = await poolCounters(control);
  const healthCost = b.acquisitions - a.acquisitions;
  console.log("one request of each read, before the load:");
  console.log("| route | bytes sent (gzip) | bytes unpacked | database queries |");
  console.log("|---|---|---|---|");
  for (const step of steps) {
    const plain = await fetch(url(step.path), { headers: { ...step.headers, "Accept-Encoding": "identity" } });
    const body = Buffer.from(await plain.arrayBuffer());
    const unpacked = body.byteLength;
    if (process.env.LOAD_DUMP_DIR) writeFileSync(path.join(process.env.LOAD_DUMP_DIR, `${step.route.replace(/\W+/g, "-")}.txt`), body);
    const before = await poolCounters(control);
    const sample = await new Promise<number>((resolve, reject) => {
      const req = http.request({ host: control.host, port: control.port, path: step.path, agent: control.agent, headers: { ...step.headers, "Accept-Encoding": "gzip" } }, (res) => {
        let n = 0;
        res.on("data", (c: Buffer) => (n += c.length));
        res.on("end", () => resolve(n));
      });
      req.on("error", reject);
      req.end();
    });
    const after = await poolCounters(control);
    const queries = after.acquisitions - before.acquisitions - healthCost;
    console.log(`| ${step.route} | ${sample} | ${unpacked} | ${queries >= 0 ? queries : "n/a"} |`);
  }
  console.log("");
}

/** The pool counters /api/health reports with DB_POOL_STATS=1 (the server's own type). */
type PoolCounters = PoolStats;
type PoolDelta = PoolCounters & { processes: number };

/**
 * Every web process's counters, summed: /api/health answers with the counters of the process it
 * reached, and the cluster's primary deals new connections round-robin, so asking a few times
 * over fresh connections reaches each of them (the newest answer of each process counts).
 */
async function poolCounters(control: ReturnType<typeof makeTarget>): Promise<PoolCounters & { processes: number }> {
  const byPid = new Map<number, PoolCounters>();
  for (let i = 0; i < webProcessCount * 2 + (webProcessCount > 1 ? 2 : 0); i++) {
    const res = await fetch(`http://${control.host}:${control.port}/api/health`, { headers: { Connection: "close" } });
    const body = (await res.json()) as { pool?: PoolCounters; pid?: number };
    if (!body.pool) throw new Error("/api/health has no pool counters (DB_POOL_STATS=1 not honoured)");
    byPid.set(body.pid ?? 0, body.pool);
    if (webProcessCount === 1) break;
  }
  const all = [...byPid.values()];
  const sum = (k: keyof PoolCounters) => all.reduce((n, p) => n + p[k], 0);
  return {
    max: sum("max"),
    acquisitions: sum("acquisitions"),
    queued: sum("queued"),
    queuedMsTotal: sum("queuedMsTotal"),
    maxWaitMs: Math.max(...all.map((p) => p.maxWaitMs)),
    failed: sum("failed"),
    processes: byPid.size,
  };
}

function delta(a: PoolDelta, b: PoolDelta): PoolDelta {
  // maxWaitMs is a running maximum: the later value bounds this phase's longest wait.
  return { processes: b.processes, max: b.max, acquisitions: b.acquisitions - a.acquisitions, queued: b.queued - a.queued, queuedMsTotal: b.queuedMsTotal - a.queuedMsTotal, maxWaitMs: b.maxWaitMs, failed: b.failed - a.failed };
}

/** Samples the database's open connections every 250 ms (all clients: app, worker, pg-boss). */
function sampleConnections(databaseUrl: string) {
  let maxConnections = 0;
  let running = true;
  const loop = (async () => {
    const pg = (await import("pg")).default;
    const client = new pg.Client({ connectionString: databaseUrl });
    await client.connect();
    try {
      while (running) {
        const r = await client.query<{ n: string }>("SELECT count(*) AS n FROM pg_stat_activity WHERE datname = current_database() AND pid <> pg_backend_pid()");
        maxConnections = Math.max(maxConnections, Number(r.rows[0]!.n));
        await new Promise((res) => setTimeout(res, 250));
      }
    } finally {
      await client.end();
    }
  })();
  return {
    async stop() {
      running = false;
      await loop;
      return { maxConnections };
    },
  };
}

const ms = (v: number) => (Number.isFinite(v) ? `${Math.round(v)}` : "–");

/** Where the phase's CPU went: the app per answered request, and the share of one core of everything else. */
interface CpuShares {
  appMsPerRequest: number;
  /** Percent of one core over the phase. */
  app: number;
  worker: number;
  postgres: number;
  loadGenerator: number;
  /** Everything else on the machine (other people's programs), with the busiest by name. */
  others: number;
  busiestOthers: { name: string; percent: number }[];
  loadAverage: number;
}

function cpuShares(before: CpuSnapshot, after: CpuSnapshot, self: NodeJS.CpuUsage, ours: { app: number; worker?: number; postgres?: number }, requests: number): CpuShares {
  const wall = after.at - before.at;
  const pct = (cpuMs: number) => Math.round((cpuMs / wall) * 1000) / 10;
  const app = treeCpuMs(before, after, ours.app);
  const worker = ours.worker ? treeCpuMs(before, after, ours.worker) : 0;
  const postgres = ours.postgres ? treeCpuMs(before, after, ours.postgres) : 0;
  const generator = (self.user + self.system) / 1000;
  const roots = [ours.app, ours.worker, ours.postgres, process.pid].filter((p): p is number => p !== undefined);
  const others = Math.max(0, machineCpuMs(before, after) - app - worker - postgres - generator);
  return {
    appMsPerRequest: Math.round((app / Math.max(1, requests)) * 10) / 10,
    app: pct(app),
    worker: pct(worker),
    postgres: pct(postgres),
    loadGenerator: pct(generator),
    others: pct(others),
    busiestOthers: busiestOthers(before, after, roots).map((p) => ({ name: p.name, percent: pct(p.ms) })),
    loadAverage: Math.round(loadavg()[0]! * 100) / 100,
  };
}

/** The cluster's main process id (first line of postmaster.pid); its backends are its children. */
function postmasterPid(dataDir: string): number | undefined {
  try {
    return Number(readFileSync(path.join(dataDir, "postmaster.pid"), "utf8").split("\n")[0]) || undefined;
  } catch {
    return undefined;
  }
}

function printLevel(users: number, o: LoadOptions, rows: RouteSummary[], pool: PoolDelta, db: { maxConnections: number }, cpu: CpuShares) {
  console.log(`${users} concurrent users, ${o.seconds} s, ${o.thinkMs} ms between a user's requests, an analysis running:`);
  console.log("| route | requests | errors | p50 ms | p95 ms | p99 ms | max ms | req/s |");
  console.log("|---|---|---|---|---|---|---|---|");
  for (const r of rows) console.log(`| ${r.route} | ${r.requests} | ${r.errors} | ${ms(r.p50)} | ${ms(r.p95)} | ${ms(r.p99)} | ${ms(r.max)} | ${r.perSecond.toFixed(1)} |`);
  for (const r of rows) if (r.reasons.length > 0) console.log(`  ${r.route} errors: ${r.reasons.join("; ")}`);
  console.log(
    `pool (max ${pool.max}${pool.processes > 1 ? `, summed over ${pool.processes} web processes` : ""}): ${pool.acquisitions} connections handed out, ${pool.queued} queued (${pool.queued === 0 ? "no waits" : `mean wait ${Math.round(pool.queuedMsTotal / pool.queued)} ms`}), longest acquisition so far ${pool.maxWaitMs} ms, ${pool.failed} failed; database connections open at most ${db.maxConnections}`,
  );
  const beside = cpu.busiestOthers.length > 0 ? ` (busiest: ${cpu.busiestOthers.map((p) => `${p.name} ${p.percent} %`).join(", ")})` : "";
  console.log(
    `CPU, % of one core: app ${cpu.app} (${cpu.appMsPerRequest} ms per answered request), worker ${cpu.worker}, PostgreSQL ${cpu.postgres}, load generator ${cpu.loadGenerator}; beside the bench: other programs ${cpu.others}${beside}; load average ${cpu.loadAverage}\n`,
  );
}

function targetVerdict(users: number, rows: RouteSummary[]): { met: boolean; line: string } {
  const reads = rows.filter((r) => READS.includes(r.route));
  const errors = rows.filter((r) => r.route !== "all").reduce((n, r) => n + r.errors, 0);
  const p95 = Math.max(...reads.map((r) => r.p95));
  if (users <= 50) {
    const met = errors === 0 && p95 < 300;
    return { met, line: `target at ${users} users (p95 < 300 ms on the reads, 0 errors): ${met ? "met" : "MISSED"} — worst read p95 ${ms(p95)} ms, ${errors} errors` };
  }
  const met = errors === 0;
  return { met, line: `target at ${users} users (0 errors): ${met ? "met" : "MISSED"} — ${errors} errors, worst read p95 ${ms(p95)} ms` };
}
