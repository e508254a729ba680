/**
 * Analyses and their follow-up jobs (scans, relation tests, time courses) in PostgreSQL. Free
 * functions taking the database first; lab ids come from a permission check made by the caller.
 */
import { sql } from "kysely";
import type { AnalysisStatus, JsonObject } from "~/db/schema";
import type { Limits } from "./params";
import { ENGINE_VERSION } from "./engine-version";
import type { AnalysesDb, JobKind, JobRow } from "./schema";

export const DEFAULT_LIMITS: Limits = { maxTimeLimitSeconds: 300, maxBasisSize: 5000 };

export async function labLimits(db: AnalysesDb, labId: string): Promise<Limits> {
  const row = await db.selectFrom("lab_analysis_settings").select(["max_time_limit_seconds", "max_basis_size"]).where("lab_id", "=", labId).executeTakeFirst();
  return row ? { maxTimeLimitSeconds: row.max_time_limit_seconds, maxBasisSize: row.max_basis_size } : DEFAULT_LIMITS;
}

export async function setLabLimits(db: AnalysesDb, labId: string, limits: Limits): Promise<void> {
  await db
    .insertInto("lab_analysis_settings")
    .values({ lab_id: labId, max_time_limit_seconds: limits.maxTimeLimitSeconds, max_basis_size: limits.maxBasisSize })
    .onConflict((oc) => oc.column("lab_id").doUpdateSet({ max_time_limit_seconds: limits.maxTimeLimitSeconds, max_basis_size: limits.maxBasisSize, updated_at: sql`now()` }))
    .execute();
}

export interface NewJob {
  kind: JobKind;
  labId: string;
  networkVersionId: string;
  parentId: string | null;
  params: JsonObject;
  startedBy: string;
  timeLimitSeconds: number;
  notify: boolean;
}

export async function insertJob(db: AnalysesDb, job: NewJob): Promise<JobRow> {
  return db
    .insertInto("analyses")
    .values({
      kind: job.kind,
      lab_id: job.labId,
      network_version_id: job.networkVersionId,
      parent_id: job.parentId,
      params: job.params,
      started_by: job.startedBy,
      time_limit_seconds: job.timeLimitSeconds,
      notify_by_email: job.notify,
      engine_version: ENGINE_VERSION,
      progress: { stage: "queued", message: "waiting for a worker" },
    })
    .returningAll()
    .executeTakeFirstOrThrow();
}

/** A job with what pages need about its network; undefined for other labs (no existence leak). */
export interface JobRecord extends JobRow {
  network_id: string;
  network_name: string;
  version_number: number;
  starter_name: string | null;
  starter_email: string | null;
}

function jobQuery(db: AnalysesDb) {
  return db
    .selectFrom("analyses as a")
    .innerJoin("network_versions as v", "v.id", "a.network_version_id")
    .innerJoin("networks as n", "n.id", "v.network_id")
    .leftJoin("users as u", "u.id", "a.started_by")
    .selectAll("a")
    .select(["n.id as network_id", "n.name as network_name", "v.number as version_number", "u.display_name as starter_name", "u.email as starter_email"]);
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export async function findJob(db: AnalysesDb, labId: string, id: string | undefined): Promise<JobRecord | undefined> {
  if (!id || !UUID.test(id)) return undefined;
  return (await jobQuery(db).where("a.id", "=", id).where("a.lab_id", "=", labId).executeTakeFirst()) as JobRecord | undefined;
}

export async function findJobById(db: AnalysesDb, id: string): Promise<JobRecord | undefined> {
  return (await jobQuery(db).where("a.id", "=", id).executeTakeFirst()) as JobRecord | undefined;
}

export async function listJobs(db: AnalysesDb, labId: string, filter: { kind?: JobKind; networkId?: string; parentId?: string; limit?: number } = {}): Promise<JobRecord[]> {
  let q = jobQuery(db).where("a.lab_id", "=", labId);
  if (filter.kind) q = q.where("a.kind", "=", filter.kind);
  if (filter.networkId) q = q.where("n.id", "=", filter.networkId);
  if (filter.parentId) q = q.where("a.parent_id", "=", filter.parentId);
  return (await q.orderBy("a.created_at", "desc").limit(filter.limit ?? 200).execute()) as JobRecord[];
}

/**
 * Cancels a job: a queued one at once; a running one by setting the flag its worker polls with
 * every heartbeat (the worker then kills the child process). Returns the status afterwards.
 */
export async function requestCancel(db: AnalysesDb, id: string): Promise<AnalysisStatus> {
  const queued = await db
    .updateTable("analyses")
    .set({ status: "cancelled", cancel_requested_at: sql`now()`, finished_at: sql`now()`, error: "Cancelled before a worker started it.", progress: { stage: "cancelled" } })
    .where("id", "=", id)
    .where("status", "=", "queued")
    .returning("status")
    .executeTakeFirst();
  if (queued) return "cancelled";
  await db.updateTable("analyses").set({ cancel_requested_at: sql`coalesce(cancel_requested_at, now())` }).where("id", "=", id).where("status", "=", "running").execute();
  const row = await db.selectFrom("analyses").select("status").where("id", "=", id).executeTakeFirstOrThrow();
  return row.status;
}

export const isFinished = (s: AnalysisStatus) => s === "succeeded" || s === "failed" || s === "cancelled";

/** The JSON the API and the polling page share. */
export function jobJson(j: JobRecord, options: { result?: boolean } = {}) {
  return {
    id: j.id,
    kind: j.kind,
    status: j.status,
    parentId: j.parent_id,
    network: { id: j.network_id, name: j.network_name, version: j.version_number },
    engineVersion: j.engine_version,
    params: j.params,
    progress: j.progress,
    error: j.error,
    attempts: j.attempts,
    timeLimitSeconds: j.time_limit_seconds,
    cancelRequested: j.cancel_requested_at !== null,
    startedBy: j.starter_name,
    createdAt: j.created_at.toISOString(),
    startedAt: j.started_at?.toISOString() ?? null,
    finishedAt: j.finished_at?.toISOString() ?? null,
    timings: j.timings,
    ...(options.result ? { result: j.result } : {}),
  };
}
export type JobJson = ReturnType<typeof jobJson>;
