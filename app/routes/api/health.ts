import { db, poolStats } from "~/db.server";
import { getEnv } from "~/env.server";
import { checkHealth } from "~/health.server";
import pkg from "../../../package.json";

/**
 * GET /api/health — for load balancers and people: 200 when the database answers and every
 * migration is applied, 503 otherwise (the body says which). With DB_POOL_STATS=1 (the load
 * bench sets it) the body also has the pool's counters: how often requests queued for a connection,
 * and the id of the web process that answered.
 */
export async function loader() {
  const health = await checkHealth(db(), pkg.version);
  // The pool is per web process (WEB_PROCESSES): `pid` says whose counters these are.
  const body = getEnv().dbPool.exposeStats ? { ...health, pool: poolStats(), pid: process.pid } : health;
  return Response.json(body, {
    status: health.ok ? 200 : 503,
    headers: { "Cache-Control": "no-store" },
  });
}
