/** The download responses of an analysis page and its shared copy (same files, same code). */
import { exportAnalysis, EXPORT_FILES, scanCsv, type ExportFile } from "./exports";
import { listJobs, type JobRecord } from "./repository.server";
import type { AnalysisResult, ScanResult } from "./result-types";
import type { DbExecutor } from "~/db/schema";
import { notFound } from "~/shared/responses";


export async function downloadResponse(db: DbExecutor, job: JobRecord, file: string | undefined): Promise<Response> {
  const safeName = job.network_name.replace(/[^A-Za-z0-9_-]+/g, "-").toLowerCase();
  const attach = (body: string, type: string, name: string) =>
    new Response(body, { headers: { "Content-Type": type, "Content-Disposition": `attachment; filename="${safeName}-v${job.version_number}-${name}"` } });
  const scan = /^scan-([0-9a-f-]{36})\.csv$/.exec(file ?? "");
  if (scan) {
    const child = (await listJobs(db, job.lab_id, { parentId: job.id, kind: "scan" })).find((c) => c.id === scan[1]);
    if (!child || child.status !== "succeeded") throw notFound();
    return attach(scanCsv(child.result as unknown as ScanResult), "text/csv; charset=utf-8", file!);
  }
  if (!EXPORT_FILES.includes(file as ExportFile) || job.status !== "succeeded") throw notFound();
  const out = exportAnalysis(file as ExportFile, job.result as unknown as AnalysisResult, {
    network: job.network_name,
    version: job.version_number,
    engineVersion: job.engine_version,
    analysisId: job.id,
  });
  return attach(out.body, out.contentType, file!);
}
