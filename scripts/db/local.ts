/**
 * The product's own PostgreSQL for `npm start` / `npm run dev`: installed if needed, cluster in
 * PG_CLUSTER_DIR (default .data/postgres), port DB_PORT (default 5433), database DB_NAME.
 */
import type { Env } from "../../app/env.server";
import { log } from "../lib/log";
import { ensureDatabase, ensurePostgresInstalled, initCluster, startCluster, stopCluster } from "./postgres";

export async function startLocalDatabase(env: Env) {
  const url = new URL(env.databaseUrl);
  const isLocal = url.hostname === "127.0.0.1" || url.hostname === "localhost";
  if (process.env.DATABASE_URL && !isLocal) {
    log("db", `using the external database at ${url.host} (DATABASE_URL); not starting a local one`);
    return { stop() {} };
  }
  const port = Number(url.port || 5432);
  const bin = ensurePostgresInstalled();
  const cluster = initCluster(bin, env.pgClusterDir, port);
  const startedHere = await startCluster(bin, cluster);
  await ensureDatabase(port, decodeURIComponent(url.pathname.slice(1)));
  return {
    stop() {
      if (startedHere) stopCluster(bin, cluster);
    },
  };
}
