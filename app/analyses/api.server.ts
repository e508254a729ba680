/** Helpers of the analyses JSON API: body parsing and job lookup with the API's error shape. */
import { apiError } from "~/permissions/api-errors";
import type { LabAccess } from "~/permissions/permissions.server";
import { findJob, jobJson, type JobRecord } from "./repository.server";
import type { DbExecutor, JobKind } from "~/db/schema";

export async function readJsonBody(request: Request): Promise<Record<string, unknown>> {
  let body: unknown;
  try {
    body = await request.json();
  } catch {
    throw apiError("invalid_request", "The body must be a JSON object (Content-Type: application/json).");
  }
  if (!body || typeof body !== "object" || Array.isArray(body)) throw apiError("invalid_request", "The body must be a JSON object.");
  return body as Record<string, unknown>;
}

export async function requireApiJob(db: DbExecutor, access: LabAccess, id: string | undefined, kind: JobKind): Promise<JobRecord> {
  const job = await findJob(db, access.lab.id, id);
  if (!job || job.kind !== kind) throw apiError("not_found", `No such ${kind === "analysis" ? "analysis" : kind} in this lab.`);
  return job;
}

export function requireMethod(request: Request, allowed: string[]): void {
  if (!allowed.includes(request.method)) throw apiError("method_not_allowed", `Use ${allowed.join(" or ")} here.`, undefined, { Allow: allowed.join(", ") });
}

export function jobResource(labSlug: string, job: JobRecord, withResult: boolean) {
  const base = job.kind === "analysis" ? `/api/labs/${labSlug}/analyses/${job.id}` : `/api/labs/${labSlug}/scans/${job.id}`;
  return { ...jobJson(job, { result: withResult }), links: { self: base, cancel: `${base}/cancel` } };
}
