import type { Route } from "./+types/analyses";
import { db } from "~/db.server";
import { jobResource, readJsonBody, requireMethod } from "~/analyses/api.server";
import { findJobById, listJobs } from "~/analyses/repository.server";
import { startAnalysis } from "~/analyses/service.server";
import { requireNetwork, requireVersion } from "~/networks/pages.server";
import { requireBody } from "~/api/body";
import { ANALYSIS_CREATE } from "~/api/schemas";
import { apiError } from "~/permissions/api-errors";
import { requireApiLabRole } from "~/permissions/permissions.server";
import { isUuid } from "~/shared/uuid";

/** GET /api/labs/:labSlug/analyses[?networkId=] — the lab's analyses, newest first (no results; fetch each). */
export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireApiLabRole(request, params.labSlug, "viewer");
  const networkId = new URL(request.url).searchParams.get("networkId") ?? undefined;
  const jobs = await listJobs(db(), access.lab.id, { kind: "analysis", networkId: isUuid(networkId) ? networkId : undefined });
  return Response.json({ analyses: jobs.map((j) => jobResource(access.lab.slug, j, false)) });
}

/**
 * POST /api/labs/:labSlug/analyses — start one. Body: ANALYSIS_CREATE (app/api/schemas.ts), checked
 * by its zod schema, then against the network by the settings parser. 202 with the queued analysis.
 */
export async function action({ request, params }: Route.ActionArgs) {
  const access = await requireApiLabRole(request, params.labSlug, "editor");
  requireMethod(request, ["POST"]);
  const body = requireBody(ANALYSIS_CREATE, await readJsonBody(request));
  const network = await requireNetwork(db(), access, body.networkId, true);
  const version = await requireVersion(db(), network, body.version === undefined || body.version === null ? null : String(body.version), true);
  const adb = db();
  const outcome = await startAnalysis(adb, access, version, body);
  if (!outcome.ok) throw apiError("invalid_request", "The analysis settings have problems.", { problems: outcome.problems });
  const job = (await findJobById(adb, outcome.job.id))!;
  return Response.json({ analysis: jobResource(access.lab.slug, job, false) }, { status: 202 });
}
