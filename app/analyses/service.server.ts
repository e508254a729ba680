/**
 * Starting and cancelling jobs, shared by the pages and the JSON API. Callers have already passed
 * the permission check (editor for these); this module validates, stores and enqueues. The web
 * server only parses the network file here — the algebra runs in the worker.
 */
import { parseNetworkCsv, type Network } from "@domain/network/index";
import { getEnv } from "~/env.server";
import { enqueue } from "~/jobs/queue.server";
import type { LabAccess } from "~/permissions/permissions.server";
import type { VersionRecord } from "~/networks/networks.server";
import { parseAnalysisParams, parseRelationParams, parseScanParams, parseTimeCourseParams, type AnalysisParams, type Problems } from "./params";
import { recordRunAudit, runDetails } from "./audit.server";
import { findJobById, insertJobWithinCaps, isFinished, labLimits, requestCancel, type JobRecord } from "./repository.server";
import type { DbExecutor, JobKind, JobRow, JsonObject } from "~/db/schema";
import { type AuditKind, recordAudit } from "~/shared/audit.server";

export type StartOutcome = { ok: true; job: JobRow } | { ok: false; problems: Problems };

/** Enqueue failures are not fatal: the row stays queued and every worker's sweep re-sends orphans. */
async function queue(job: JobRow): Promise<void> {
  try {
    await enqueue(getEnv().databaseUrl, job.id, job.time_limit_seconds);
  } catch (e) {
    console.error(`[analyses] could not enqueue ${job.id}: ${(e as Error).message}`);
  }
}

export function networkOf(csv: string): Network {
  return parseNetworkCsv(csv);
}

export async function startAnalysis(db: DbExecutor, access: LabAccess, version: VersionRecord, input: Record<string, unknown>): Promise<StartOutcome> {
  const parsed = parseAnalysisParams(input, networkOf(version.csv), await labLimits(db, access.lab.id));
  if (!parsed.ok) return parsed;
  const inserted = await insertJobWithinCaps(db, {
    kind: "analysis",
    labId: access.lab.id,
    networkVersionId: version.id,
    parentId: null,
    params: parsed.value as unknown as JsonObject,
    startedBy: access.user.id,
    timeLimitSeconds: parsed.value.timeLimitSeconds,
    notify: parsed.value.notify,
  });
  if (!inserted.ok) return { ok: false, problems: [{ field: "queue", message: inserted.message }] };
  await queue(inserted.job);
  await auditStart(db, access, inserted.job);
  return { ok: true, job: inserted.job };
}

async function auditStart(db: DbExecutor, access: LabAccess, job: JobRow): Promise<void> {
  const record = await findJobById(db, job.id);
  if (record) await recordRunAudit(db, access, "analysis.started", runDetails(record));
}

/** A scan, relation test or time course hanging off an analysis (same network version and settings). */
export async function startFollowUp(db: DbExecutor, access: LabAccess, parent: JobRecord, kind: Exclude<JobKind, "analysis">, input: Record<string, unknown>): Promise<StartOutcome> {
  if (parent.kind !== "analysis") return { ok: false, problems: [{ field: "analysis", message: "scans, relation tests and time courses start from an analysis" }] };
  const limits = await labLimits(db, access.lab.id);
  const parentParams = parent.params as unknown as AnalysisParams;
  const version = await db.selectFrom("network_versions").select("csv").where("id", "=", parent.network_version_id).executeTakeFirstOrThrow();
  const network = networkOf(version.csv);
  const parsed =
    kind === "scan"
      ? parseScanParams(input, network, parentParams, limits)
      : kind === "relation"
        ? parseRelationParams(input, limits)
        : parseTimeCourseParams(input, network, limits);
  if (!parsed.ok) return parsed;
  if (kind === "timecourse" && (parentParams.rateMode !== "numeric" || !parentParams.initial))
    return { ok: false, problems: [{ field: "endTime", message: "a time course needs an analysis with numeric rate constants and initial concentrations" }] };
  const inserted = await insertJobWithinCaps(db, {
    kind,
    labId: access.lab.id,
    networkVersionId: parent.network_version_id,
    parentId: parent.id,
    params: parsed.value as unknown as JsonObject,
    startedBy: access.user.id,
    timeLimitSeconds: parsed.value.timeLimitSeconds,
    notify: false,
  });
  if (!inserted.ok) return { ok: false, problems: [{ field: "queue", message: inserted.message }] };
  await queue(inserted.job);
  await auditStart(db, access, inserted.job);
  return { ok: true, job: inserted.job };
}

/** Cancels a job and notes it in the lab's trail (a job already finished is left alone, and not noted). */
export async function cancelJob(db: DbExecutor, access: LabAccess, job: JobRecord) {
  if (isFinished(job.status)) return job.status;
  const status = await requestCancel(db, job.id);
  await recordRunAudit(db, access, "analysis.cancelled", runDetails(job));
  return status;
}

/** An analysis event in the lab's audit trail (the shared writer, with this feature's kinds). */
export async function recordAnalysisAudit(db: DbExecutor, labId: string, actorId: string, kind: AuditKind & `analysis.${string}`, details: JsonObject): Promise<void> {
  await recordAudit(db, { kind, actorId, labId, details });
}
