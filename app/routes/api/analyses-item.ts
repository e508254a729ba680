import type { Route } from "./+types/analyses-item";
import { db } from "~/db.server";
import { jobResource, requireApiJob, requireMethod } from "~/analyses/api.server";
import { findJobById } from "~/analyses/repository.server";
import { cancelJob } from "~/analyses/service.server";
import { requireApiLabRole } from "~/permissions/permissions.server";

/** GET /api/labs/:labSlug/analyses/:analysisId — status, progress and (once succeeded) the result. */
export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireApiLabRole(request, params.labSlug, "viewer");
  const job = await requireApiJob(db(), access, params.analysisId, "analysis");
  return Response.json({ analysis: jobResource(access.lab.slug, job, true) });
}

/** DELETE — cancel (same as POST …/cancel). */
export async function action({ request, params }: Route.ActionArgs) {
  const access = await requireApiLabRole(request, params.labSlug, "editor");
  requireMethod(request, ["DELETE"]);
  const adb = db();
  const job = await requireApiJob(adb, access, params.analysisId, "analysis");
  await cancelJob(adb, access, job);
  return Response.json({ analysis: jobResource(access.lab.slug, (await findJobById(adb, job.id))!, false) }, { status: 202 });
}
