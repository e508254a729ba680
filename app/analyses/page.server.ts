/** Everything the analysis page (and its read-only shared copy) shows, as plain JSON. */
import { analysedNetwork } from "./analysed-network";
import { rateSymbols } from "./params";
import type { AnalysisParams } from "./params";
import { presentResult } from "./present";
import { jobJson, listJobs, type JobRecord } from "./repository.server";
import type { AnalysisResult } from "./result-types";
import type { DbExecutor } from "~/db/schema";
import { networkOf } from "./service.server";
import { distributedRunsOf } from "./distributed-runs.server";

export async function analysisPageData(db: DbExecutor, job: JobRecord, options: { sharedView: boolean }) {
  const children = await listJobs(db, job.lab_id, { parentId: job.id });
  const visible = options.sharedView ? children.filter((c) => c.status === "succeeded") : children;
  const version = await db.selectFrom("network_versions").select("csv").where("id", "=", job.network_version_id).executeTakeFirstOrThrow();
  const network = networkOf(version.csv);
  const params = job.params as unknown as AnalysisParams;
  // A run that has not succeeded shows what its worker stored as stages finished, marked partial.
  const result = (job.status === "succeeded" ? job.result : job.partial_result) as unknown as AnalysisResult | null;
  const partial = job.status !== "succeeded" && result !== null;
  // A share link shows no member names or e-mail to people outside the lab.
  const redact = <T extends { startedBy: string | null }>(j: T): T => (options.sharedView ? { ...j, startedBy: null } : j);
  const childJson = (kind: string) => visible.filter((c) => c.kind === kind).map((c) => redact(jobJson(c, { result: c.status === "succeeded" })));
  return {
    job: redact(jobJson(job)),
    params,
    result,
    partial,
    view: result ? presentResult(result, params) : null,
    rates: rateSymbols(network),
    species: [...network.species],
    // The pinned version's reactions and the rate values the run used (also on share links, which grant this version).
    network: analysedNetwork(version.csv, params),
    numeric: params.rateMode === "numeric" && params.initial !== null,
    relations: childJson("relation"),
    scans: childJson("scan"),
    timeCourses: childJson("timecourse"),
    distributed: await distributedRunsOf(db, job.id, options),
  };
}
export type AnalysisPageData = Awaited<ReturnType<typeof analysisPageData>>;
