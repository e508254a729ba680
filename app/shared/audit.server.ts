/**
 * The audit trail: every feature writes its events here (one list of kinds) and the lab and
 * account pages read them back.
 */
import type { DbExecutor, JsonObject } from "~/db/schema";

export type AuditKind =
  | "auth.signed_in"
  | "auth.account_created"
  | "auth.signed_out_everywhere"
  | "lab.created"
  | "lab.renamed"
  | "examples.copied"
  | "membership.role_changed"
  | "membership.removed"
  | "membership.left"
  | "invitation.sent"
  | "invitation.resent"
  | "invitation.revoked"
  | "invitation.accepted"
  | "api_token.created"
  | "api_token.revoked"
  | "network.deleted"
  | "analysis.limits_changed"
  | "analysis.share_link_created"
  | "analysis.share_link_revoked";

export async function recordAudit(
  db: DbExecutor,
  event: { kind: AuditKind; actorId: string | null; labId?: string | null; details?: JsonObject },
): Promise<void> {
  await db
    .insertInto("audit_events")
    .values({ kind: event.kind, actor_id: event.actorId, lab_id: event.labId ?? null, details: event.details ?? {} })
    .execute();
}

export interface AuditEntry {
  id: string;
  kind: string;
  actorName: string | null;
  actorEmail: string | null;
  details: JsonObject;
  createdAt: Date;
}

/** Newest first: a lab's trail (for its owners). */
export async function listLabAudit(db: DbExecutor, labId: string, limit = 200): Promise<AuditEntry[]> {
  const rows = await db
    .selectFrom("audit_events as a")
    .leftJoin("users as u", "u.id", "a.actor_id")
    .select(["a.id", "a.kind", "a.details", "a.created_at", "u.display_name", "u.email"])
    .where("a.lab_id", "=", labId)
    .orderBy("a.created_at", "desc")
    .limit(limit)
    .execute();
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    actorName: r.display_name,
    actorEmail: r.email,
    details: r.details,
    createdAt: r.created_at,
  }));
}

/** Newest first: a person's own account events (sign-ins, tokens), shown on the account page. */
export async function listAccountEvents(db: DbExecutor, userId: string, limit = 20) {
  return db
    .selectFrom("audit_events")
    .select(["id", "kind", "details", "created_at"])
    .where("actor_id", "=", userId)
    .where("lab_id", "is", null)
    .orderBy("created_at", "desc")
    .limit(limit)
    .execute();
}
