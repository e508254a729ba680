/**
 * The lab's audit trail for runs. Each event keeps the names it needs to be read later as a
 * sentence (network, version, run name), because the run or network may since have been renamed
 * or deleted. Sentences are made in app/labs/audit-text.ts.
 */
import type { JsonObject } from "~/db/schema";
import type { LabAccess } from "~/permissions/permissions.server";
import type { JobRecord } from "./repository.server";
import type { DbExecutor } from "~/db/schema";

export type RunAuditKind =
  | "analysis.started"
  | "analysis.cancelled"
  | "analysis.renamed"
  | "analysis.note_changed"
  | "analysis.archived"
  | "analysis.unarchived"
  | "analysis.deleted"
  | "analysis.share_link_created"
  | "analysis.share_link_revoked"
  | "analysis.limits_changed";

/** What every run event says about its run. */
export function runDetails(job: JobRecord): JsonObject {
  return { analysisId: job.id, jobKind: job.kind, parentId: job.parent_id, networkId: job.network_id, networkName: job.network_name, version: job.version_number, name: job.name };
}

export async function recordRunAudit(db: DbExecutor, access: Pick<LabAccess, "lab" | "user">, kind: RunAuditKind, details: JsonObject): Promise<void> {
  await db.insertInto("audit_events").values({ lab_id: access.lab.id, actor_id: access.user.id, kind, details }).execute();
}
