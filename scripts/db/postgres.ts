/**
 * A project-local PostgreSQL from Debian's `postgresql` package: install (apt-get), initdb,
 * start on 127.0.0.1 only, create a database, stop. The server refuses to run as root, so as
 * root every server command runs as the `postgres` system user through `runuser`.
 */
import { execFileSync, spawnSync } from "node:child_process";
import { chmodSync, chownSync, existsSync, mkdirSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { createHash } from "node:crypto";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import pg from "pg";
import { aptInstall } from "../lib/apt";
import { log } from "../lib/log";

const PG_ROOT = "/usr/lib/postgresql";
const isRoot = process.getuid?.() === 0;

export interface Cluster {
  /** Folder holding `data/` (the cluster) and `server.log`. */
  dir: string;
  dataDir: string;
  logFile: string;
  port: number;
}

/** The newest installed server's bin folder, or undefined. */
export function findPgBin(): string | undefined {
  if (!existsSync(PG_ROOT)) return undefined;
  const majors = readdirSync(PG_ROOT)
    .filter((d) => /^\d+$/.test(d) && existsSync(path.join(PG_ROOT, d, "bin", "pg_ctl")))
    .sort((a, b) => Number(b) - Number(a));
  return majors.length ? path.join(PG_ROOT, majors[0], "bin") : undefined;
}

/** Server binaries, installing Debian's package when missing. */
export function ensurePostgresInstalled(): string {
  const found = findPgBin();
  if (found) return found;
  log("db", "PostgreSQL server binaries not found; installing Debian's postgresql package");
  aptInstall(["postgresql"]);
  const bin = findPgBin();
  if (!bin) throw new Error(`apt-get installed postgresql but no server binaries appeared under ${PG_ROOT}`);
  return bin;
}

/** Runs a server binary as the unprivileged user (root → postgres via runuser). */
function runPg(bin: string, args: string[], options: { allowFail?: boolean } = {}) {
  const [cmd, fullArgs] = isRoot ? ["runuser", ["-u", "postgres", "--", bin, ...args]] : [bin, args];
  const res = spawnSync(cmd, fullArgs, { encoding: "utf8", cwd: "/" });
  if (res.status !== 0 && !options.allowFail) {
    throw new Error(`${path.basename(bin)} ${args.join(" ")} failed (exit ${res.status}):\n${res.stderr || res.stdout}`);
  }
  return res;
}

function postgresIds() {
  const uid = Number(execFileSync("id", ["-u", "postgres"], { encoding: "utf8" }).trim());
  const gid = Number(execFileSync("id", ["-g", "postgres"], { encoding: "utf8" }).trim());
  return { uid, gid };
}

/** Can the server user enter and write `dir`? (Every parent folder must be enterable.) */
function serverUserCanUse(dir: string): boolean {
  if (!isRoot) return true;
  const res = spawnSync("runuser", ["-u", "postgres", "--", "test", "-w", dir, "-a", "-x", dir], { cwd: "/" });
  return res.status === 0;
}

function prepareDir(dir: string) {
  mkdirSync(dir, { recursive: true });
  if (isRoot) {
    const { uid, gid } = postgresIds();
    chownSync(dir, uid, gid);
    chmodSync(dir, 0o700);
  }
}

/**
 * Where the cluster of `wantedDir` actually lives: the folder itself when the server user can
 * reach it, else a per-project folder under the postgres user's home (said out loud).
 */
export function resolveClusterDir(wantedDir: string): string {
  prepareDir(wantedDir);
  if (serverUserCanUse(wantedDir)) return wantedDir;
  const key = createHash("sha256").update(path.resolve(wantedDir)).digest("hex").slice(0, 12);
  const fallback = path.join("/var/lib/postgresql", `stillpoint-${key}`);
  log(
    "db",
    `the postgres user cannot enter ${wantedDir} (a parent folder is not enterable); keeping the cluster in ${fallback} instead`,
  );
  prepareDir(fallback);
  if (!serverUserCanUse(fallback)) throw new Error(`the postgres user cannot use ${fallback} either`);
  return fallback;
}

/** initdb once (trust auth on loopback, superuser `postgres`); a no-op for an existing cluster. */
export function initCluster(bin: string, wantedDir: string, port: number): Cluster {
  const dir = resolveClusterDir(wantedDir);
  const dataDir = path.join(dir, "data");
  const cluster = { dir, dataDir, logFile: path.join(dir, "server.log"), port };
  if (existsSync(path.join(dataDir, "PG_VERSION"))) return cluster;
  log("db", `initialising a new cluster in ${dataDir}`);
  prepareDir(dataDir);
  runPg(path.join(bin, "initdb"), ["-D", dataDir, "-U", "postgres", "--auth=trust", "--no-locale", "-E", "UTF8"]);
  return cluster;
}

export function isRunning(bin: string, cluster: Cluster): boolean {
  return runPg(path.join(bin, "pg_ctl"), ["-D", cluster.dataDir, "status"], { allowFail: true }).status === 0;
}

export function portIsFree(port: number, host = "127.0.0.1"): Promise<boolean> {
  return new Promise((resolve) => {
    const server = net.createServer();
    server.once("error", () => resolve(false));
    server.listen(port, host, () => server.close(() => resolve(true)));
  });
}

/** A port the OS says is free on loopback right now. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

/**
 * Starts the server on 127.0.0.1:<port> with no Unix socket. Returns false when it was already
 * running (then the caller must not stop it).
 */
export async function startCluster(bin: string, cluster: Cluster, options: { throwaway?: boolean } = {}) {
  if (isRunning(bin, cluster)) {
    log("db", `PostgreSQL already running for ${cluster.dataDir}; reusing it`);
    return false;
  }
  if (!(await portIsFree(cluster.port))) {
    throw new Error(
      `port ${cluster.port} on 127.0.0.1 is taken by another program; set DB_PORT to a free port`,
    );
  }
  const settings = [
    "-c listen_addresses=127.0.0.1",
    `-p ${cluster.port}`,
    "-c unix_socket_directories=''",
    ...(options.throwaway ? ["-c fsync=off", "-c synchronous_commit=off", "-c full_page_writes=off"] : []),
  ].join(" ");
  if (isRoot) {
    // The log file lives beside the cluster, owned by the server user.
    writeFileSync(cluster.logFile, "", { flag: "a" });
    const { uid, gid } = postgresIds();
    chownSync(cluster.logFile, uid, gid);
  }
  runPg(path.join(bin, "pg_ctl"), ["-D", cluster.dataDir, "-l", cluster.logFile, "-o", settings, "-w", "-t", "60", "start"]);
  log("db", `PostgreSQL listening on 127.0.0.1:${cluster.port} (log: ${cluster.logFile})`);
  return true;
}

export function stopCluster(bin: string, cluster: Cluster) {
  if (!isRunning(bin, cluster)) return;
  runPg(path.join(bin, "pg_ctl"), ["-D", cluster.dataDir, "-m", "fast", "-w", "-t", "60", "stop"]);
  log("db", "PostgreSQL stopped");
}

export function serverUrl(port: number, database = "postgres") {
  return `postgres://postgres@127.0.0.1:${port}/${database}`;
}

/** CREATE DATABASE unless it exists. */
export async function ensureDatabase(port: number, name: string) {
  const client = new pg.Client({ connectionString: serverUrl(port) });
  await client.connect();
  try {
    const { rowCount } = await client.query("SELECT 1 FROM pg_database WHERE datname = $1", [name]);
    if (!rowCount) {
      await client.query(`CREATE DATABASE ${pg.escapeIdentifier(name)}`);
      log("db", `created database ${name}`);
    }
  } finally {
    await client.end();
  }
}

/** A throw-away cluster in a temp folder on a free port (for tests); `dispose` removes it. */
export async function startThrowawayCluster() {
  const bin = ensurePostgresInstalled();
  const tmp = path.join(os.tmpdir(), `stillpoint-pg-${process.pid}-${Date.now()}`);
  const port = await freePort();
  const cluster = initCluster(bin, tmp, port);
  await startCluster(bin, cluster, { throwaway: true });
  return {
    cluster,
    port,
    dispose() {
      try {
        stopCluster(bin, cluster);
      } finally {
        rmSync(cluster.dir, { recursive: true, force: true });
        if (cluster.dir !== tmp) rmSync(tmp, { recursive: true, force: true });
      }
    },
  };
}
