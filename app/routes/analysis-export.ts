import type { Route } from "./+types/analysis-export";
import { db } from "~/db.server";
import { downloadResponse } from "~/analyses/download.server";
import { findJob } from "~/analyses/repository.server";
import { requireLabRole } from "~/permissions/permissions.server";
import { notFound } from "~/shared/responses";

/** GET …/analyses/:analysisId/export/:file — result.json, parametrisation.csv, steady-states.csv, formulas.tex, scan-<id>.csv. */
export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireLabRole(request, params.labSlug, "viewer");
  const job = await findJob(db(), access.lab.id, params.analysisId);
  if (!job) throw notFound();
  return downloadResponse(db(), job, params.file);
}
