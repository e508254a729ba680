import type { Kysely } from "kysely";
import type { Database, DbExecutor, LabRole } from "~/db/schema";
import { randomToken, sha256Hex } from "~/auth/hashing.server";
import { recordAudit } from "~/shared/audit.server";

export const INVITATION_DAYS = 7;

export class InvitationError extends Error {
  constructor(
    public readonly code: "already_member" | "not_found" | "expired" | "used" | "revoked" | "wrong_address",
    message: string,
  ) {
    super(message);
    this.name = "InvitationError";
  }
}

export type InvitationStatus = "pending" | "expired" | "accepted" | "revoked";

export interface InvitationRow {
  id: string;
  email: string;
  role: LabRole;
  invitedBy: string | null;
  createdAt: Date;
  expiresAt: Date;
  status: InvitationStatus;
}

function statusOf(row: { accepted_at: Date | null; revoked_at: Date | null; expires_at: Date }, now = new Date()): InvitationStatus {
  if (row.accepted_at) return "accepted";
  if (row.revoked_at) return "revoked";
  return row.expires_at <= now ? "expired" : "pending";
}

const newExpiry = (now = new Date()) => new Date(now.getTime() + INVITATION_DAYS * 86_400_000);

/**
 * Invites an address to a lab. Returns the secret token for the e-mailed link; only its SHA-256
 * is stored. An open invitation to the same address is replaced (its old link stops working).
 */
export async function createInvitation(
  db: Kysely<Database>,
  args: { labId: string; actorId: string; email: string; role: LabRole },
): Promise<{ token: string; id: string; expiresAt: Date }> {
  return db.transaction().execute(async (trx) => {
    const member = await trx
      .selectFrom("memberships as m")
      .innerJoin("users as u", "u.id", "m.user_id")
      .select("m.role")
      .where("m.lab_id", "=", args.labId)
      .where("u.email", "=", args.email)
      .executeTakeFirst();
    if (member) throw new InvitationError("already_member", `${args.email} is already a member of this lab (${member.role}).`);
    await trx
      .updateTable("invitations")
      .set({ revoked_at: new Date() })
      .where("lab_id", "=", args.labId)
      .where("email", "=", args.email)
      .where("accepted_at", "is", null)
      .where("revoked_at", "is", null)
      .execute();
    const token = randomToken(32);
    const expiresAt = newExpiry();
    const row = await trx
      .insertInto("invitations")
      .values({ lab_id: args.labId, email: args.email, role: args.role, token_hash: sha256Hex(token), invited_by: args.actorId, expires_at: expiresAt })
      .returning("id")
      .executeTakeFirstOrThrow();
    await recordAudit(trx, {
      kind: "invitation.sent",
      actorId: args.actorId,
      labId: args.labId,
      details: { invitationId: row.id, email: args.email, role: args.role },
    });
    return { token, id: row.id, expiresAt };
  });
}

/** A new link (and seven fresh days) for an open or expired invitation; the old link dies. */
export async function resendInvitation(db: Kysely<Database>, args: { labId: string; actorId: string; invitationId: string }) {
  return db.transaction().execute(async (trx) => {
    const token = randomToken(32);
    const expiresAt = newExpiry();
    const row = await trx
      .updateTable("invitations")
      .set({ token_hash: sha256Hex(token), expires_at: expiresAt })
      .where("id", "=", args.invitationId)
      .where("lab_id", "=", args.labId)
      .where("accepted_at", "is", null)
      .where("revoked_at", "is", null)
      .returning(["id", "email", "role"])
      .executeTakeFirst();
    if (!row) throw new InvitationError("not_found", "That invitation is no longer open.");
    await recordAudit(trx, { kind: "invitation.resent", actorId: args.actorId, labId: args.labId, details: { invitationId: row.id, email: row.email } });
    return { token, expiresAt, email: row.email, role: row.role };
  });
}

export async function revokeInvitation(db: Kysely<Database>, args: { labId: string; actorId: string; invitationId: string }) {
  await db.transaction().execute(async (trx) => {
    const row = await trx
      .updateTable("invitations")
      .set({ revoked_at: new Date() })
      .where("id", "=", args.invitationId)
      .where("lab_id", "=", args.labId)
      .where("accepted_at", "is", null)
      .where("revoked_at", "is", null)
      .returning(["id", "email"])
      .executeTakeFirst();
    if (!row) throw new InvitationError("not_found", "That invitation is no longer open.");
    await recordAudit(trx, { kind: "invitation.revoked", actorId: args.actorId, labId: args.labId, details: { invitationId: row.id, email: row.email } });
  });
}

/** Invitations not yet accepted or revoked (expired ones included, so owners can resend). */
export async function listOpenInvitations(db: DbExecutor, labId: string): Promise<InvitationRow[]> {
  const rows = await db
    .selectFrom("invitations as i")
    .leftJoin("users as u", "u.id", "i.invited_by")
    .select(["i.id", "i.email", "i.role", "i.created_at", "i.expires_at", "i.accepted_at", "i.revoked_at", "u.display_name"])
    .where("i.lab_id", "=", labId)
    .where("i.accepted_at", "is", null)
    .where("i.revoked_at", "is", null)
    .orderBy("i.created_at", "desc")
    .execute();
  return rows.map((r) => ({
    id: r.id,
    email: r.email,
    role: r.role,
    invitedBy: r.display_name,
    createdAt: r.created_at,
    expiresAt: r.expires_at,
    status: statusOf(r),
  }));
}

/** What the accept page shows for a link: the lab, the role, the address, and whether it still works. */
export async function findInvitationByToken(db: DbExecutor, token: string) {
  if (!/^[A-Za-z0-9_-]{20,100}$/.test(token)) return undefined;
  const row = await db
    .selectFrom("invitations as i")
    .innerJoin("labs as l", "l.id", "i.lab_id")
    .select(["i.id", "i.email", "i.role", "i.expires_at", "i.accepted_at", "i.revoked_at", "l.name as lab_name", "l.slug as lab_slug"])
    .where("i.token_hash", "=", sha256Hex(token))
    .executeTakeFirst();
  if (!row) return undefined;
  return { id: row.id, email: row.email, role: row.role, labName: row.lab_name, labSlug: row.lab_slug, status: statusOf(row) };
}

/**
 * Accepts an invitation as `user`, who must be signed in with the invited address. Single use:
 * the row is locked and marked accepted in the same transaction that adds the membership.
 * Someone already in the lab keeps the higher of their role and the invited one.
 */
export async function acceptInvitation(db: Kysely<Database>, args: { token: string; userId: string; email: string }) {
  return db.transaction().execute(async (trx) => {
    const row = await trx
      .selectFrom("invitations")
      .select(["id", "lab_id", "email", "role", "expires_at", "accepted_at", "revoked_at"])
      .where("token_hash", "=", sha256Hex(args.token))
      .forUpdate()
      .executeTakeFirst();
    if (!row) throw new InvitationError("not_found", "This invitation link is not valid.");
    const status = statusOf(row);
    if (status === "accepted") throw new InvitationError("used", "This invitation has already been used.");
    if (status === "revoked") throw new InvitationError("revoked", "This invitation was withdrawn by the lab.");
    if (status === "expired") throw new InvitationError("expired", "This invitation has expired. Ask the lab owner to send a new one.");
    if (row.email !== args.email.toLowerCase()) {
      throw new InvitationError("wrong_address", `This invitation is for ${row.email}. Sign in with that address to accept it.`);
    }
    const existing = await trx
      .selectFrom("memberships")
      .select("role")
      .where("lab_id", "=", row.lab_id)
      .where("user_id", "=", args.userId)
      .executeTakeFirst();
    const rank = { viewer: 1, editor: 2, owner: 3 } as const;
    if (!existing) {
      await trx.insertInto("memberships").values({ lab_id: row.lab_id, user_id: args.userId, role: row.role }).execute();
    } else if (rank[row.role] > rank[existing.role]) {
      await trx.updateTable("memberships").set({ role: row.role }).where("lab_id", "=", row.lab_id).where("user_id", "=", args.userId).execute();
    }
    await trx.updateTable("invitations").set({ accepted_at: new Date(), accepted_by: args.userId }).where("id", "=", row.id).execute();
    await recordAudit(trx, {
      kind: "invitation.accepted",
      actorId: args.userId,
      labId: row.lab_id,
      details: { invitationId: row.id, email: row.email, role: row.role },
    });
    const lab = await trx.selectFrom("labs").select(["slug", "name"]).where("id", "=", row.lab_id).executeTakeFirstOrThrow();
    return { labSlug: lab.slug, labName: lab.name, role: row.role };
  });
}
