import type { Route } from "./+types/share-export";
import { db } from "~/db.server";
import { downloadResponse } from "~/analyses/download.server";
import { findSharedAnalysis } from "~/analyses/share.server";
import { notFound } from "~/shared/responses";

/** Downloads of a shared analysis, with the same token check as the page. */
export async function loader({ params }: Route.LoaderArgs) {
  const job = await findSharedAnalysis(db(), params.token);
  if (!job || job.parent_id) throw notFound();
  return downloadResponse(db(), job, params.file);
}
