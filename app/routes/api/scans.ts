import type { Route } from "./+types/scans";
import { db } from "~/db.server";
import { jobResource, readJsonBody, requireApiJob, requireMethod } from "~/analyses/api.server";
import { findJobById, listJobs } from "~/analyses/repository.server";
import { startFollowUp } from "~/analyses/service.server";
import { requireBody } from "~/api/body";
import { SCAN_CREATE } from "~/api/schemas";
import { apiError } from "~/permissions/api-errors";
import { requireApiLabRole } from "~/permissions/permissions.server";

/** GET /api/labs/:labSlug/analyses/:analysisId/scans — the scans started from this analysis. */
export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireApiLabRole(request, params.labSlug, "viewer");
  const adb = db();
  const parent = await requireApiJob(adb, access, params.analysisId, "analysis");
  const scans = await listJobs(adb, access.lab.id, { parentId: parent.id, kind: "scan" });
  return Response.json({ scans: scans.map((s) => jobResource(access.lab.slug, s, false)) });
}

/**
 * POST — start a scan. Body: SCAN_CREATE (app/api/schemas.ts), checked by its zod schema, then by the
 * scan settings parser. The analysis must have numeric rate constants and initial concentrations.
 */
export async function action({ request, params }: Route.ActionArgs) {
  const access = await requireApiLabRole(request, params.labSlug, "editor");
  requireMethod(request, ["POST"]);
  const adb = db();
  const parent = await requireApiJob(adb, access, params.analysisId, "analysis");
  const outcome = await startFollowUp(adb, access, parent, "scan", requireBody(SCAN_CREATE, await readJsonBody(request)));
  if (!outcome.ok) throw apiError("invalid_request", "The scan settings have problems.", { problems: outcome.problems });
  return Response.json({ scan: jobResource(access.lab.slug, (await findJobById(adb, outcome.job.id))!, false) }, { status: 202 });
}
