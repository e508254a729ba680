/**
 * Analyses and their follow-up jobs (scans, relation tests, time courses) in PostgreSQL. Free
 * functions taking the database first; lab ids come from a permission check made by the caller.
 */
import { sql } from "kysely";
import { SITE_LIMITS, type Limits } from "./params";

export { SITE_LIMITS };
import { ENGINE_VERSION } from "./engine-version";
import { isUuid } from "~/shared/uuid";
import type { AnalysisStatus, DbExecutor, JobKind, JobRow, JsonObject } from "~/db/schema";

export const DEFAULT_LIMITS: Limits = { maxTimeLimitSeconds: 300, maxBasisSize: 5000 };

export async function labLimits(db: DbExecutor, labId: string): Promise<Limits> {
  const row = await db.selectFrom("lab_analysis_settings").select(["max_time_limit_seconds", "max_basis_size"]).where("lab_id", "=", labId).executeTakeFirst();
  if (!row) return DEFAULT_LIMITS;
  // A value stored before the site maximum existed is capped on the way out.
  return { maxTimeLimitSeconds: Math.min(row.max_time_limit_seconds, SITE_LIMITS.maxTimeLimitSeconds), maxBasisSize: row.max_basis_size };
}

export async function setLabLimits(db: DbExecutor, labId: string, limits: Limits): Promise<void> {
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

export async function insertJob(db: DbExecutor, job: NewJob): Promise<JobRow> {
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

/**
 * insertJob, unless the starter (in all their labs) or the lab already has the site's maximum of
 * jobs waiting or running: counted and inserted in one transaction under advisory locks on the lab
 * and the starter, so a burst of parallel requests cannot slip past the cap. Returns a message for the person when refused.
 */
export async function insertJobWithinCaps(db: DbExecutor, job: NewJob): Promise<{ ok: true; job: JobRow } | { ok: false; message: string }> {
  return db.transaction().execute(async (trx) => {
    // Lab before user, always in this order, so two starters never wait on each other in a cycle.
    for (const key of [`jobs:lab:${job.labId}`, `jobs:user:${job.startedBy}`]) {
      await sql`SELECT pg_advisory_xact_lock(hashtextextended(${key}, 16))`.execute(trx);
    }
    const active = await trx
      .selectFrom("analyses")
      .select([
        sql<number>`count(*) FILTER (WHERE lab_id = ${job.labId})::int`.as("lab"),
        sql<number>`count(*) FILTER (WHERE started_by = ${job.startedBy})::int`.as("mine"),
      ])
      .where((eb) => eb.or([eb("lab_id", "=", job.labId), eb("started_by", "=", job.startedBy)]))
      .where("status", "in", ["queued", "running"])
      .executeTakeFirstOrThrow();
    if (active.mine >= SITE_LIMITS.maxActiveJobsPerUser) {
      return { ok: false as const, message: `you already have ${active.mine} jobs waiting or running (at most ${SITE_LIMITS.maxActiveJobsPerUser}); start more when some have finished, or cancel one` };
    }
    if (active.lab >= SITE_LIMITS.maxActiveJobsPerLab) {
      return { ok: false as const, message: `this lab already has ${active.lab} jobs waiting or running (at most ${SITE_LIMITS.maxActiveJobsPerLab}); start more when some have finished` };
    }
    return { ok: true as const, job: await insertJob(trx, job) };
  });
}

/** A job with what pages need about its network; undefined for other labs (no existence leak). */
export interface JobRecord extends JobRow {
  network_id: string;
  network_name: string;
  version_number: number;
  starter_name: string | null;
  starter_email: string | null;
}

function jobQuery(db: DbExecutor) {
  return db
    .selectFrom("analyses as a")
    .innerJoin("network_versions as v", "v.id", "a.network_version_id")
    .innerJoin("networks as n", "n.id", "v.network_id")
    .leftJoin("users as u", "u.id", "a.started_by")
    .selectAll("a")
    .select(["n.id as network_id", "n.name as network_name", "v.number as version_number", "u.display_name as starter_name", "u.email as starter_email"]);
}

export async function findJob(db: DbExecutor, labId: string, id: string | undefined): Promise<JobRecord | undefined> {
  if (!isUuid(id)) return undefined;
  return (await jobQuery(db).where("a.id", "=", id).where("a.lab_id", "=", labId).executeTakeFirst()) as JobRecord | undefined;
}

export async function findJobById(db: DbExecutor, id: string): Promise<JobRecord | undefined> {
  return (await jobQuery(db).where("a.id", "=", id).executeTakeFirst()) as JobRecord | undefined;
}

export async function listJobs(
  db: DbExecutor,
  labId: string,
  filter: { kind?: JobKind; networkId?: string; versionNumber?: number; status?: AnalysisStatus; parentId?: string; limit?: number } = {},
): Promise<JobRecord[]> {
  let q = jobQuery(db).where("a.lab_id", "=", labId);
  if (filter.kind) q = q.where("a.kind", "=", filter.kind);
  if (filter.networkId) q = q.where("n.id", "=", filter.networkId);
  if (filter.versionNumber !== undefined) q = q.where("v.number", "=", filter.versionNumber);
  if (filter.status) q = q.where("a.status", "=", filter.status);
  if (filter.parentId) q = q.where("a.parent_id", "=", filter.parentId);
  return (await q.orderBy("a.created_at", "desc").limit(filter.limit ?? 200).execute()) as JobRecord[];
}

/**
 * Cancels a job: a queued one at once; a running one by setting the flag its worker polls with
 * every heartbeat (the worker then kills the child process). Returns the status afterwards.
 */
export async function requestCancel(db: DbExecutor, id: string): Promise<AnalysisStatus> {
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
    name: j.name,
    note: j.note,
    archived: j.archived_at !== null,
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
    ...(options.result ? { result: j.result, partialResult: j.partial_result } : {}),
  };
}
export type JobJson = ReturnType<typeof jobJson>;
