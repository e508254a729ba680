import type { Kysely, Transaction } from "kysely";
import type { Database, DbExecutor, LabRole } from "~/db/schema";
import { recordAudit } from "~/shared/audit.server";

export class MembershipError extends Error {
  constructor(
    public readonly code: "last_owner" | "not_member",
    message: string,
  ) {
    super(message);
    this.name = "MembershipError";
  }
}

export interface MemberRow {
  userId: string;
  email: string;
  displayName: string;
  role: LabRole;
  since: Date;
}

const ROLE_ORDER: Record<LabRole, number> = { owner: 0, editor: 1, viewer: 2 };

export async function listMembers(db: DbExecutor, labId: string): Promise<MemberRow[]> {
  const rows = await db
    .selectFrom("memberships as m")
    .innerJoin("users as u", "u.id", "m.user_id")
    .select(["u.id", "u.email", "u.display_name", "m.role", "m.created_at"])
    .where("m.lab_id", "=", labId)
    .execute();
  return rows
    .map((r) => ({ userId: r.id, email: r.email, displayName: r.display_name, role: r.role, since: r.created_at }))
    .sort((a, b) => ROLE_ORDER[a.role] - ROLE_ORDER[b.role] || a.displayName.localeCompare(b.displayName));
}

/**
 * Locks the lab's membership rows and returns the target's current role. Taking the lock on every
 * change means two owners demoting each other at once cannot leave the lab without an owner.
 */
async function lockMembers(trx: Transaction<Database>, labId: string, userId: string) {
  const rows = await trx.selectFrom("memberships").select(["user_id", "role"]).where("lab_id", "=", labId).forUpdate().execute();
  const target = rows.find((r) => r.user_id === userId);
  if (!target) throw new MembershipError("not_member", "That person is not a member of this lab.");
  const owners = rows.filter((r) => r.role === "owner").length;
  // The address goes into the audit details so the log stays readable after the account is gone.
  const person = await trx.selectFrom("users").select("email").where("id", "=", userId).executeTakeFirst();
  return { role: target.role, owners, email: person?.email ?? null };
}

const LAST_OWNER = "A lab needs at least one owner: make someone else an owner first.";

export async function changeRole(db: Kysely<Database>, args: { labId: string; actorId: string; userId: string; role: LabRole }) {
  await db.transaction().execute(async (trx) => {
    const { role: from, owners, email } = await lockMembers(trx, args.labId, args.userId);
    if (from === args.role) return;
    if (from === "owner" && owners <= 1) throw new MembershipError("last_owner", LAST_OWNER);
    await trx
      .updateTable("memberships")
      .set({ role: args.role })
      .where("lab_id", "=", args.labId)
      .where("user_id", "=", args.userId)
      .execute();
    await recordAudit(trx, {
      kind: "membership.role_changed",
      actorId: args.actorId,
      labId: args.labId,
      details: { userId: args.userId, email, from, to: args.role },
    });
  });
}

/** Removes a member (by an owner) or, when actor and member are the same person, leaves. */
export async function removeMember(db: Kysely<Database>, args: { labId: string; actorId: string; userId: string }) {
  await db.transaction().execute(async (trx) => {
    const { role, owners, email } = await lockMembers(trx, args.labId, args.userId);
    if (role === "owner" && owners <= 1) throw new MembershipError("last_owner", LAST_OWNER);
    await trx.deleteFrom("memberships").where("lab_id", "=", args.labId).where("user_id", "=", args.userId).execute();
    const leaving = args.actorId === args.userId;
    await recordAudit(trx, {
      kind: leaving ? "membership.left" : "membership.removed",
      actorId: args.actorId,
      labId: args.labId,
      details: { userId: args.userId, email, role },
    });
  });
}
