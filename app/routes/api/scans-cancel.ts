import type { Route } from "./+types/scans-cancel";
import { db } from "~/db.server";
import { jobResource, requireApiJob, requireMethod } from "~/analyses/api.server";
import { findJobById } from "~/analyses/repository.server";
import { cancelJob } from "~/analyses/service.server";
import { requireApiLabRole } from "~/permissions/permissions.server";

/** POST /api/labs/:labSlug/scans/:scanId/cancel. */
export async function action({ request, params }: Route.ActionArgs) {
  const access = await requireApiLabRole(request, params.labSlug, "editor");
  requireMethod(request, ["POST"]);
  const adb = db();
  const job = await requireApiJob(adb, access, params.scanId, "scan");
  await cancelJob(adb, access, job);
  return Response.json({ scan: jobResource(access.lab.slug, (await findJobById(adb, job.id))!, false) }, { status: 202 });
}
