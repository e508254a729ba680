/**
 * `npm run bench -- --workers N`: one large basis over Q on 1 and on N workers (issue: one big
 * computation on many workers). Starts its own throw-away PostgreSQL, migrates it, and for each
 * worker count starts that many worker processes (`app/jobs/worker.server.ts`, image queue only),
 * lets this process coordinate (as an analysis' job process does), and times the whole basis,
 * wall clock. Also times the single-process composition (the CLI's path, no database) and checks
 * that all three give the same basis. Reports the speed-up, bytes stored per image and the time
 * from enqueue to start; writes bench/results/distributed.json. Never a timed test.
 */
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { cpus, loadavg } from "node:os";
import path from "node:path";
import { PolynomialRing, QQ, groebnerBasis } from "@domain/algebra/index";
import type { Polynomial, Rational } from "@domain/algebra/index";
import { Limits } from "@domain/algebra/groebner/limits";
import type { ImageTracing, MultiModularStats } from "@domain/algebra/f4/multimodular";
import { encodeImageTrace, imageModPrime, liftPrimes, multiModularGroebnerQQ, multiModularInput } from "@domain/algebra/f4/multimodular";
import { blockOrderBasisQQ } from "@domain/algebra/f4/block-order-lift";
import { homogenisedRoute, seriesRoute } from "@domain/algebra/f4/distribution";
import { ensureDatabase, serverUrl, startThrowawayCluster } from "../../scripts/db/postgres";
import { outputTail, sleep, startProcess, type Managed } from "../../scripts/lib/processes";
import { migrate } from "../../scripts/migrate";
import { createDb } from "~/db.server";
import { distributedGroebner, type DistributedOutcome } from "~/jobs/coordinator.server";
import { stopBosses } from "~/jobs/queue.server";
import { parseSystemFile } from "./system-file";

export const DISTRIBUTED_USAGE = `npm run bench -- --workers N [--only katsura-8,phospho-4site-measured] [--batches B] [--window W]
  times each system on 1 and on N workers (default 2) and alone in one process; see bench/README.md`;

interface Row {
  name: string;
  order: string;
  elements: number;
  primes: number;
  singleMs: number;
  singleStats: MultiModularStats;
  byWorkers: { workers: number; wallMs: number; outcome: DistributedOutcome; timeline: TaskTimes[] }[];
  same: boolean;
}

export async function runDistributed(argv: string[], root: string): Promise<number> {
  const arg = (name: string) => {
    const i = argv.indexOf(name);
    return i >= 0 ? argv[i + 1] : undefined;
  };
  if (argv.includes("--help")) {
    console.log(DISTRIBUTED_USAGE);
    return 0;
  }
  const N = Number(arg("--workers") ?? 2);
  if (!Number.isInteger(N) || N < 1) throw new RangeError(`--workers: expected a whole number ≥ 1, got ${arg("--workers")}`);
  const names = (arg("--only") ?? "katsura-8,phospho-4site-measured").split(",");
  const batches = Number(arg("--batches") ?? 4 * N);
  const window = Number(arg("--window") ?? 2 * N + 2);
  const counts = [...new Set([1, N])];
  console.log(`machine: ${cpus().length} cores; load average (1 min) at start ${loadavg()[0].toFixed(2)}; workers ${counts.join(" and ")}; proof in ${batches} pair batches; ${window} images ahead`);

  const pg = await startThrowawayCluster();
  const url = serverUrl(pg.port, "stillpoint_bench");
  const rows: Row[] = [];
  try {
    await ensureDatabase(pg.port, "stillpoint_bench");
    await migrate(url);
    const db = createDb(url, { max: 4 });
    try {
      for (const name of names) rows.push(await measure(name, root, url, db, counts, batches, window));
    } finally {
      await stopBosses();
      await db.destroy();
    }
  } finally {
    pg.dispose();
  }
  console.log(`\n${table(rows, counts)}`);
  console.log(`load average (1 min) at end: ${loadavg()[0].toFixed(2)} (above ${cpus().length}: other jobs shared the machine, times are inflated)`);
  mkdirSync(path.join(root, "bench", "results"), { recursive: true });
  writeFileSync(path.join(root, "bench", "results", "distributed.json"), JSON.stringify({ generatedAt: new Date().toISOString(), cores: cpus().length, rows }, null, 2) + "\n");
  console.log("written: bench/results/distributed.json");
  return rows.every((r) => r.same) ? 0 : 1;
}

function readSystem(root: string, name: string) {
  const f = parseSystemFile(readFileSync(path.join(root, "bench", "systems", `${name}.txt`), "utf8"));
  const R = new PolynomialRing(f.vars, QQ, f.order);
  const polys = f.polys.map((s) => R.parse(s));
  const graded = /^(grevlex|grlex)$/.test(f.order);
  // Lex and block orders are proven against a grevlex basis (Hilbert series of I^h), computed first and not timed.
  let reference: Polynomial<Rational>[] | undefined;
  if (!graded) {
    const Rg = R.withOrder("grevlex");
    reference = groebnerBasis(polys.map((p) => Rg.parse(R.format(p))), { fglm: false });
  }
  return { R, polys, reference, order: f.order };
}

async function measure(name: string, root: string, url: string, db: ReturnType<typeof createDb>, counts: number[], batches: number, window: number): Promise<Row> {
  const { R, polys, reference, order } = readSystem(root, name);
  // The CLI's path: one process, no database.
  let stats: MultiModularStats = { primes: 0, unlucky: 0, modularMs: 0, liftMs: 0, proofMs: 0 };
  const t0 = Date.now();
  // Lex and block orders go through I^h with the Hilbert-series proof, as groebnerBasis does
  // (f4/block-order-lift.ts); the distributed runs lift I^h's basis and set h = 1 over Q at the end.
  const series = reference ? seriesRoute(R, reference) : null;
  const seriesInput = series?.input();
  let single = reference ? blockOrderBasisQQ(polys, reference, new Limits(), { stats }) : multiModularGroebnerQQ(polys, new Limits(), { stats });
  // Step 3 by Hilbert functions cannot prove an ideal whose homogenisation is not saturated (a
  // saturated steady-state ideal): as an analysis does, compute the homogenised ideal's basis and
  // set h = 1 (f4/distribution.ts, homogenisedRoute), here and in the distributed runs below.
  const route = !single && stats.failed === "hilbert" ? homogenisedRoute(multiModularInput(polys)) : null;
  if (route) {
    stats = { primes: 0, unlucky: 0, modularMs: 0, liftMs: 0, proofMs: 0 };
    const Rh = new PolynomialRing(route.input.vars, QQ, route.input.order);
    const Gh = multiModularGroebnerQQ(route.input.polys.map((s) => Rh.parse(s)), new Limits(), { stats });
    single = Gh ? route.finish(Gh.map((g) => Rh.format(g)), new Limits()).map((s) => R.parse(s)) : null;
  }
  const singleMs = Date.now() - t0;
  if (!single) throw new Error(`${name}: the multi-modular path cannot prove this ideal (${stats.failed}); pick another system`);
  const want = single.map((g) => R.format(g));
  console.log(`${name} (${order}${route ? ", through its homogenisation" : ""}): one process ${(singleMs / 1000).toFixed(2)} s (images ${(stats.modularMs / 1000).toFixed(2)} s, lift ${(stats.liftMs / 1000).toFixed(2)} s, proof ${(stats.proofMs / 1000).toFixed(2)} s), ${stats.primes} primes`);
  const byWorkers: Row["byWorkers"] = [];
  let same = true;
  for (const k of counts) {
    const workers = await startWorkers(root, url, k);
    try {
      // Untimed warm-up: every worker's task process forked and compiled.
      const small = new PolynomialRing(["a", "b", "c"], QQ, "grevlex");
      await distributedGroebner(multiModularInput(["a^2 + b*c - 1", "b^2 - a*c + 2", "c^2 + a*b - 3"].map((s) => small.parse(s))), { db, databaseUrl: url, coordinatorId: "bench", window: 2 * k, pairBatches: 2 * k });
      const input = route ? route.input : seriesInput ?? multiModularInput(polys);
      const w0 = Date.now();
      // As an analysis does (domain/algebra/f4/distribution.ts): the coordinator computes the
      // first image itself, learning its F4 run, and the workers replay that run.
      const tracing: ImageTracing = { trace: undefined, replayed: 0, declined: 0 };
      const image = imageModPrime(input, liftPrimes(input).next().value as number, new Limits(), { k: 1, of: 1 }, undefined, tracing);
      const firstImage = { image, ms: Date.now() - w0, ...(tracing.trace ? { trace: encodeImageTrace(input, tracing.trace) } : {}) };
      const outcome = await distributedGroebner(input, { db, databaseUrl: url, coordinatorId: "bench", window, pairBatches: batches, firstImage });
      const basis = !outcome.basis ? outcome.basis
        : route ? route.finish(outcome.basis, new Limits())
        : series ? series.finish(outcome.basis.map((s) => series.polys[0].ring.parse(s)), new Limits()).map((g) => R.format(g))
        : outcome.basis;
      const wallMs = Date.now() - w0;
      const ok = JSON.stringify(basis) === JSON.stringify(want);
      same &&= ok;
      byWorkers.push({ workers: k, wallMs, outcome, timeline: await timelineOf(db, outcome.runId) });
      console.log(`  ${k} worker${k === 1 ? "" : "s"}: ${(wallMs / 1000).toFixed(2)} s (images ${(outcome.timings.imagesMs / 1000).toFixed(2)} s, lift ${(outcome.timings.liftMs / 1000).toFixed(2)} s of it, proof ${(outcome.timings.proofMs / 1000).toFixed(2)} s); ${outcome.primes.length} primes used${outcome.declined.length ? ` (${outcome.declined.length} set aside where the trace declined)` : ""}; ${Math.round(outcome.meanImageBytes)} bytes/image; enqueue→start median ${Math.round(outcome.medianWaitMs)} ms (pick-up ${Math.round(outcome.medianPickupMs)} ms); basis ${ok ? "same" : "DIFFERS"}`);
      const split = Object.values(outcome.computeByWorker ?? {}).map((w) => `${w.tasks} tasks / ${(w.ms / 1000).toFixed(2)} s`);
      console.log(`    work per worker (compute time inside the task processes): ${split.join("; ")}`);
    } finally {
      await Promise.all(workers.map((w) => w.stop()));
    }
  }
  return { name, order, elements: want.length, primes: stats.primes, singleMs, singleStats: stats, byWorkers, same };
}

/** One task of a run, times in ms from the run's first enqueue: where a distributed run's wall time went. */
interface TaskTimes { kind: string; seq: number; worker: string | null; enqueued: number; started: number | null; finished: number | null; computeMs: number | null }

async function timelineOf(db: ReturnType<typeof createDb>, runId: string): Promise<TaskTimes[]> {
  const rows = await db.selectFrom("basis_tasks").select(["kind", "seq", "worker_id", "enqueued_at", "started_at", "finished_at", "compute_ms", "status"])
    .where("run_id", "=", runId).where("status", "=", "done").orderBy("enqueued_at").execute();
  const t0 = Math.min(...rows.map((r) => new Date(r.enqueued_at).getTime()));
  const at = (d: Date | string | null) => (d === null ? null : new Date(d).getTime() - t0);
  return rows.map((r) => ({ kind: r.kind, seq: r.seq, worker: r.worker_id, enqueued: at(r.enqueued_at)!, started: at(r.started_at), finished: at(r.finished_at), computeMs: r.compute_ms }));
}

async function startWorkers(root: string, url: string, k: number): Promise<Managed[]> {
  const ws: Managed[] = [];
  for (let i = 0; i < k; i++) {
    ws.push(startProcess(`worker ${i + 1}`, "npx", ["tsx", "app/jobs/worker.server.ts"], {
      cwd: root, quiet: true, env: { ...process.env, DATABASE_URL: url, WORKER_QUEUES: "images", QUEUE_MAINTENANCE_SECONDS: "10" },
    }));
  }
  const deadline = Date.now() + 60_000;
  for (const w of ws) {
    while (!outputTail(w).includes("ready")) {
      if (Date.now() > deadline) throw new Error(`${w.name} did not start: ${outputTail(w)}`);
      await sleep(100);
    }
  }
  return ws;
}

function table(rows: Row[], counts: number[]): string {
  const head = ["system", "basis", "primes", "one process", ...counts.map((k) => `${k} worker${k === 1 ? "" : "s"}`), ...(counts.length > 1 ? [`speed-up 1→${counts[counts.length - 1]}`] : []), "bytes/image", "enqueue→start", "pick-up", "bases"];
  const lines = rows.map((r) => {
    const t = (k: number) => r.byWorkers.find((b) => b.workers === k)!;
    const first = t(counts[0]), last = t(counts[counts.length - 1]);
    return [
      r.name, String(r.elements), String(r.primes), `${(r.singleMs / 1000).toFixed(2)} s`,
      ...counts.map((k) => `${(t(k).wallMs / 1000).toFixed(2)} s`),
      ...(counts.length > 1 ? [`${(first.wallMs / last.wallMs).toFixed(2)}×`] : []),
      String(Math.round(last.outcome.meanImageBytes)), `${Math.round(last.outcome.medianWaitMs)} ms`, `${Math.round(last.outcome.medianPickupMs)} ms`, r.same ? "same" : "DIFFERS",
    ];
  });
  const all = [head, ...lines];
  const width = head.map((_, c) => Math.max(...all.map((l) => l[c].length)));
  return all.map((l) => l.map((x, c) => x.padEnd(width[c])).join("  ")).join("\n");
}
