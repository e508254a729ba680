import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";

/**
 * Every setting of the server in one validated object. Safe local defaults so that
 * `npm start` works on a fresh machine; production overrides them through the environment.
 *
 * Database: DATABASE_URL wins; otherwise it is built from DB_HOST, DB_PORT, DB_NAME, DB_USER,
 * DB_PASSWORD (defaults 127.0.0.1:5433/stillpoint as `postgres`, the cluster scripts/db starts).
 * Mail: SMTP_URL (production relay) wins; otherwise SMTP_HOST/SMTP_PORT point at maildev.
 * Secrets: SESSION_SECRET and TOTP_SECRET; when unset, random values are generated once and kept
 * in DATA_DIR/secrets.json (git-ignored), so sessions survive restarts without committing secrets.
 */
export interface Env {
  nodeEnv: "development" | "production" | "test";
  host: string;
  port: number;
  appUrl: string;
  /** True when APP_URL is https: cookies then get the `secure` flag. */
  secureCookies: boolean;
  dataDir: string;
  databaseUrl: string;
  db: { host: string; port: number; name: string; user: string; password: string | undefined };
  /** Folder of the local PostgreSQL cluster that scripts/db manages. */
  pgClusterDir: string;
  sessionSecret: string;
  /** 64 hex characters, as remix-auth-totp requires. */
  totpSecret: string;
  smtp: { url: string | undefined; host: string; port: number };
  mailFrom: string;
  maildevWebPort: number;
  maildevUrl: string;
  logLevel: "debug" | "info" | "warn" | "error";
  /** The web server's PostgreSQL pool (db.server.ts); the worker has its own (WORKER_DB_POOL_MAX). */
  dbPool: { max: number; waitMs: number; workerMax: number; exposeStats: boolean };
}

export class EnvError extends Error {
  constructor(public readonly problems: string[]) {
    super(`Invalid environment:\n  - ${problems.join("\n  - ")}`);
    this.name = "EnvError";
  }
}

type Source = Record<string, string | undefined>;

/** Reads and validates settings from `source`; throws EnvError listing every problem at once. */
export function loadEnv(source: Source = process.env): Env {
  const problems: string[] = [];
  const get = (name: string) => {
    const v = source[name];
    return v === undefined || v.trim() === "" ? undefined : v.trim();
  };
  const port = (name: string, fallback: number) => {
    const raw = get(name);
    if (raw === undefined) return fallback;
    const n = Number(raw);
    if (!Number.isInteger(n) || n < 1 || n > 65535) {
      problems.push(`${name}: expected a port number 1-65535, got "${raw}"`);
      return fallback;
    }
    return n;
  };
  const url = (name: string, protocols: string[]) => {
    const raw = get(name);
    if (raw === undefined) return undefined;
    try {
      const u = new URL(raw);
      if (!protocols.includes(u.protocol)) {
        problems.push(`${name}: expected a ${protocols.join(" or ")} URL, got protocol "${u.protocol}"`);
      }
      return raw;
    } catch {
      problems.push(`${name}: expected a URL, got "${raw}"`);
      return undefined;
    }
  };
  const count = (name: string, fallback: number, min: number, max: number) => {
    const raw = get(name);
    if (raw === undefined) return fallback;
    const n = Number(raw);
    if (!Number.isInteger(n) || n < min || n > max) {
      problems.push(`${name}: expected a whole number from ${min} to ${max}, got "${raw}"`);
      return fallback;
    }
    return n;
  };
  const oneOf = <T extends string>(name: string, allowed: readonly T[], fallback: T): T => {
    const raw = get(name);
    if (raw === undefined) return fallback;
    if (!(allowed as readonly string[]).includes(raw)) {
      problems.push(`${name}: expected one of ${allowed.join(", ")}, got "${raw}"`);
      return fallback;
    }
    return raw as T;
  };

  const nodeEnv = oneOf("NODE_ENV", ["development", "production", "test"] as const, "development");
  const host = get("HOST") ?? "127.0.0.1";
  const httpPort = port("PORT", 3000);
  const appUrl = (url("APP_URL", ["http:", "https:"]) ?? `http://${host}:${httpPort}`).replace(/\/+$/, "");
  const dataDir = path.resolve(get("DATA_DIR") ?? ".data");

  const db = {
    host: get("DB_HOST") ?? "127.0.0.1",
    port: port("DB_PORT", 5433),
    name: get("DB_NAME") ?? "stillpoint",
    user: get("DB_USER") ?? "postgres",
    password: get("DB_PASSWORD"),
  };
  const databaseUrl = url("DATABASE_URL", ["postgres:", "postgresql:"]) ?? buildDatabaseUrl(db);

  const smtpUrl = url("SMTP_URL", ["smtp:", "smtps:"]);
  const smtp = { url: smtpUrl, host: get("SMTP_HOST") ?? "127.0.0.1", port: port("SMTP_PORT", 1025) };
  const maildevWebPort = port("MAILDEV_WEB_PORT", 1080);

  const sessionSecret = get("SESSION_SECRET");
  if (sessionSecret !== undefined && sessionSecret.length < 32) {
    problems.push("SESSION_SECRET: expected at least 32 characters");
  }
  const totpSecret = get("TOTP_SECRET");
  if (totpSecret !== undefined && !/^[0-9a-fA-F]{64}$/.test(totpSecret)) {
    problems.push("TOTP_SECRET: expected exactly 64 hexadecimal characters");
  }

  // Sizing (README "Configuration"): PostgreSQL allows 100 connections by default; the web server
  // takes DB_POOL_MAX, each worker WORKER_DB_POOL_MAX plus pg-boss's 4, the web server's pg-boss 4.
  const dbPool = {
    max: count("DB_POOL_MAX", 20, 1, 500),
    // A request waits this long for a free connection (queues) before it is answered 503.
    waitMs: count("DB_POOL_WAIT_MS", 10_000, 100, 600_000),
    workerMax: count("WORKER_DB_POOL_MAX", 4, 1, 100),
    exposeStats: get("DB_POOL_STATS") === "1",
  };

  if (problems.length > 0) throw new EnvError(problems);

  const secrets =
    sessionSecret && totpSecret ? { sessionSecret, totpSecret } : localSecrets(dataDir, sessionSecret, totpSecret);

  return {
    nodeEnv,
    host,
    port: httpPort,
    appUrl,
    secureCookies: appUrl.startsWith("https:"),
    dataDir,
    databaseUrl,
    db,
    pgClusterDir: path.resolve(get("PG_CLUSTER_DIR") ?? path.join(dataDir, "postgres")),
    ...secrets,
    smtp,
    mailFrom: get("MAIL_FROM") ?? "Stillpoint <no-reply@stillpoint.localhost>",
    maildevWebPort,
    maildevUrl: `http://127.0.0.1:${maildevWebPort}`,
    logLevel: oneOf("LOG_LEVEL", ["debug", "info", "warn", "error"] as const, "info"),
    dbPool,
  };
}

export function buildDatabaseUrl(db: Env["db"]): string {
  const auth = db.password
    ? `${encodeURIComponent(db.user)}:${encodeURIComponent(db.password)}`
    : encodeURIComponent(db.user);
  return `postgres://${auth}@${db.host}:${db.port}/${encodeURIComponent(db.name)}`;
}

/** Random local secrets, generated on first use and kept in the git-ignored data folder. */
function localSecrets(dataDir: string, session?: string, totp?: string) {
  const file = path.join(dataDir, "secrets.json");
  let stored: { sessionSecret?: string; totpSecret?: string } = {};
  if (existsSync(file)) {
    try {
      stored = JSON.parse(readFileSync(file, "utf8"));
    } catch {
      stored = {};
    }
  }
  const next = {
    sessionSecret: stored.sessionSecret ?? randomBytes(32).toString("hex"),
    totpSecret: stored.totpSecret ?? randomBytes(32).toString("hex"),
  };
  if (next.sessionSecret !== stored.sessionSecret || next.totpSecret !== stored.totpSecret) {
    mkdirSync(dataDir, { recursive: true });
    writeFileSync(file, JSON.stringify(next, null, 2) + "\n", { mode: 0o600 });
  }
  return { sessionSecret: session ?? next.sessionSecret, totpSecret: totp ?? next.totpSecret };
}

let cached: Env | undefined;

/** The process-wide settings, validated on first use. */
export function getEnv(): Env {
  cached ??= loadEnv(process.env);
  return cached;
}
