import type { Route } from "./+types/analyses-cancel";
import { db } from "~/db.server";
import { jobResource, requireApiJob, requireMethod } from "~/analyses/api.server";
import { findJobById } from "~/analyses/repository.server";
import { cancelJob } from "~/analyses/service.server";
import { requireApiLabRole } from "~/permissions/permissions.server";

/** POST /api/labs/:labSlug/analyses/:analysisId/cancel — a queued analysis is cancelled at once, a running one within a heartbeat. */
export async function action({ request, params }: Route.ActionArgs) {
  const access = await requireApiLabRole(request, params.labSlug, "editor");
  requireMethod(request, ["POST"]);
  const adb = db();
  const job = await requireApiJob(adb, access, params.analysisId, "analysis");
  await cancelJob(adb, access, job);
  return Response.json({ analysis: jobResource(access.lab.slug, (await findJobById(adb, job.id))!, false) }, { status: 202 });
}
