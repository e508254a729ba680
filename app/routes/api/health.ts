import { db } from "~/db.server";
import { checkHealth } from "~/health.server";
import pkg from "../../../package.json";

/**
 * GET /api/health — for load balancers and people: 200 when the database answers and every
 * migration is applied, 503 otherwise (the body says which).
 */
export async function loader() {
  const health = await checkHealth(db(), pkg.version);
  return Response.json(health, {
    status: health.ok ? 200 : 503,
    headers: { "Cache-Control": "no-store" },
  });
}
