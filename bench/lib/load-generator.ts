/**
 * A bounded, closed-loop HTTP load generator for `npm run bench -- --load`: a fixed number of
 * virtual users, each sending its next request only after the previous answer arrived (so the
 * load never exceeds the number of users, and a slow server gets fewer requests, not a pile-up),
 * over keep-alive connections capped at one per user. Every request has a timeout; a timeout, a
 * connection error or an unexpected status counts as an error.
 */
import http from "node:http";
import { performance } from "node:perf_hooks";

export interface Step {
  /** Row label in the report ("network list", "upload", …). */
  route: string;
  method?: "GET" | "POST";
  path: string;
  headers?: Record<string, string>;
  body?: string;
  /** Statuses that count as success (default: 200). */
  ok?: readonly number[];
  /** Pause after the answer before this user's next request (a person reading, a script's pacing). */
  thinkMs?: number;
}

export interface Sample {
  route: string;
  ms: number;
  status: number;
  /** Why it counts as an error (undefined: it did not). */
  error?: string;
}

export interface Target {
  host: string;
  port: number;
  agent: http.Agent;
  timeoutMs: number;
}

export function makeTarget(host: string, port: number, maxSockets: number, timeoutMs = 10_000): Target {
  return { host, port, agent: new http.Agent({ keepAlive: true, maxSockets }), timeoutMs };
}

/**
 * Sends one request and reads the whole answer; never rejects. Like a browser, a GET that fails
 * on a kept-alive connection before any answer arrived (the server closed that idle connection
 * just as the request went out) is sent once more on a fresh one; the time counts from the first try.
 */
export async function send(target: Target, step: Step): Promise<Sample> {
  const started = performance.now();
  const first = await attempt(target, step, started);
  if (!first.retry) return first.sample;
  return (await attempt(target, step, started)).sample;
}

function attempt(target: Target, step: Step, started: number): Promise<{ sample: Sample; retry: boolean }> {
  return new Promise((resolveAttempt) => {
    let answered = false;
    const resolve = (sample: Sample) =>
      resolveAttempt({ sample, retry: sample.status === 0 && !answered && req.reusedSocket && (step.method ?? "GET") === "GET" && sample.error !== undefined && !sample.error.startsWith("no answer") });
    let settled = false;
    const done = (status: number, error?: string) => {
      if (settled) return;
      settled = true;
      resolve({ route: step.route, ms: performance.now() - started, status, error });
    };
    const req = http.request(
      {
        host: target.host,
        port: target.port,
        method: step.method ?? "GET",
        path: step.path,
        agent: target.agent,
        // As a browser asks: compressed answers, so the server's compression is part of the cost.
        headers: { "Accept-Encoding": "gzip", ...step.headers, ...(step.body === undefined ? {} : { "Content-Length": String(Buffer.byteLength(step.body)) }) },
      },
      (res) => {
        answered = true;
        res.on("data", () => undefined);
        res.on("end", () => {
          const status = res.statusCode ?? 0;
          done(status, (step.ok ?? [200]).includes(status) ? undefined : `status ${status}`);
        });
        res.on("error", (e) => done(res.statusCode ?? 0, e.message));
      },
    );
    req.setTimeout(target.timeoutMs, () => {
      done(0, `no answer within ${target.timeoutMs} ms`);
      req.destroy();
    });
    req.on("error", (e) => done(0, e.message));
    req.end(step.body);
  });
}

/**
 * Runs `users` virtual users for `seconds`; user i repeats `script(i)` (a list of steps, which
 * may change between rounds) until time is up, then finishes its current request. People do not
 * all press a key in the same millisecond: user i arrives at i/users of `arrivalMs` (default: the
 * first step's think time), so the users are spread over one think time instead of starting as a
 * burst; the time is counted from the first arrival, and the load is the same once all are in.
 */
export async function closedLoop(target: Target, users: number, seconds: number, script: (user: number, round: number) => Step[], arrivalMs?: number): Promise<Sample[]> {
  const samples: Sample[] = [];
  const until = performance.now() + seconds * 1000;
  const spread = arrivalMs ?? script(0, 0)[0]?.thinkMs ?? 0;
  await Promise.all(
    Array.from({ length: users }, async (_, user) => {
      if (spread > 0 && user > 0) await new Promise((r) => setTimeout(r, (user / users) * spread));
      for (let round = 0; performance.now() < until; round++) {
        for (const step of script(user, round)) {
          if (performance.now() >= until) break;
          samples.push(await send(target, step));
          if (step.thinkMs) await new Promise((r) => setTimeout(r, step.thinkMs));
        }
      }
    }),
  );
  return samples;
}

/** The q-quantile (0..1) of sorted values, by the nearest-rank method. */
export function quantile(sorted: readonly number[], q: number): number {
  if (sorted.length === 0) return NaN;
  const rank = Math.ceil(q * sorted.length);
  return sorted[Math.min(sorted.length - 1, Math.max(0, rank - 1))]!;
}

export interface RouteSummary {
  route: string;
  requests: number;
  errors: number;
  p50: number;
  p95: number;
  p99: number;
  max: number;
  perSecond: number;
  /** A few distinct error reasons, for the report. */
  reasons: string[];
}

export function summarise(samples: readonly Sample[], seconds: number): RouteSummary[] {
  const byRoute = new Map<string, Sample[]>();
  for (const s of samples) {
    const list = byRoute.get(s.route);
    if (list) list.push(s);
    else byRoute.set(s.route, [s]);
  }
  const rows = [...byRoute].map(([route, list]) => summaryRow(route, list, seconds));
  if (byRoute.size > 1) rows.push(summaryRow("all", [...samples], seconds));
  return rows;
}

function summaryRow(route: string, list: readonly Sample[], seconds: number): RouteSummary {
  const ms = list.map((s) => s.ms).sort((a, b) => a - b);
  const errors = list.filter((s) => s.error !== undefined);
  return {
    route,
    requests: list.length,
    errors: errors.length,
    p50: quantile(ms, 0.5),
    p95: quantile(ms, 0.95),
    p99: quantile(ms, 0.99),
    max: ms.at(-1) ?? NaN,
    perSecond: list.length / seconds,
    reasons: [...new Set(errors.map((e) => e.error!))].slice(0, 3),
  };
}
