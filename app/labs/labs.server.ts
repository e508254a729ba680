import type { Kysely } from "kysely";
import type { Database, DbExecutor, LabRole } from "~/db/schema";
import { recordAudit } from "~/shared/audit.server";

export interface LabSummary {
  id: string;
  slug: string;
  name: string;
  role: LabRole;
  memberCount: number;
  isPublic: boolean;
}

/** "Kinetics Group (Basel)" → "kinetics-group-basel"; never empty, at most 48 characters. */
export function slugify(name: string): string {
  const slug = name
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 48)
    .replace(/-+$/g, "");
  return slug || "lab";
}

export function parseLabName(raw: unknown): { ok: true; value: string } | { ok: false; message: string } {
  const value = typeof raw === "string" ? raw.trim().replace(/\s+/g, " ") : "";
  if (!value) return { ok: false, message: "Please give the lab a name." };
  if (value.length > 120) return { ok: false, message: "Please keep the lab name under 120 characters." };
  return { ok: true, value };
}

/** Creates a lab with the creator as its first owner; the slug gets -2, -3, … when taken. */
export async function createLab(db: Kysely<Database>, args: { userId: string; name: string }) {
  return db.transaction().execute(async (trx) => {
    const base = slugify(args.name);
    const taken = new Set(
      (await trx.selectFrom("labs").select("slug").where("slug", "like", `${base}%`).execute()).map((r) => r.slug),
    );
    let slug = base;
    for (let n = 2; taken.has(slug); n++) slug = `${base}-${n}`;
    const lab = await trx
      .insertInto("labs")
      .values({ slug, name: args.name, created_by: args.userId })
      .returning(["id", "slug", "name"])
      .executeTakeFirstOrThrow();
    await trx.insertInto("memberships").values({ lab_id: lab.id, user_id: args.userId, role: "owner" }).execute();
    await recordAudit(trx, { kind: "lab.created", actorId: args.userId, labId: lab.id, details: { name: lab.name, slug } });
    return lab;
  });
}

export async function renameLab(db: Kysely<Database>, args: { labId: string; actorId: string; name: string }) {
  await db.transaction().execute(async (trx) => {
    const before = await trx.selectFrom("labs").select("name").where("id", "=", args.labId).executeTakeFirstOrThrow();
    await trx.updateTable("labs").set({ name: args.name }).where("id", "=", args.labId).execute();
    await recordAudit(trx, { kind: "lab.renamed", actorId: args.actorId, labId: args.labId, details: { from: before.name, to: args.name } });
  });
}

/** The labs a user belongs to, with their role, alphabetically. */
export async function listLabsOf(db: DbExecutor, userId: string): Promise<LabSummary[]> {
  const rows = await db
    .selectFrom("memberships as m")
    .innerJoin("labs as l", "l.id", "m.lab_id")
    .select((eb) => [
      "l.id",
      "l.slug",
      "l.name",
      "l.is_public",
      "m.role",
      eb
        .selectFrom("memberships as all_m")
        .select(eb.fn.countAll<string>().as("n"))
        .whereRef("all_m.lab_id", "=", "l.id")
        .as("member_count"),
    ])
    .where("m.user_id", "=", userId)
    .orderBy("l.name")
    .execute();
  return rows.map((r) => ({ id: r.id, slug: r.slug, name: r.name, role: r.role, memberCount: Number(r.member_count ?? 0), isPublic: r.is_public }));
}

/** The lab with this slug and the user's role in it (null when not a member); undefined when no such lab. */
export async function findLabWithRole(db: DbExecutor, slug: string, userId: string) {
  return db
    .selectFrom("labs as l")
    .leftJoin("memberships as m", (join) => join.onRef("m.lab_id", "=", "l.id").on("m.user_id", "=", userId))
    .select(["l.id", "l.slug", "l.name", "l.is_public", "m.role"])
    .where("l.slug", "=", slug)
    .executeTakeFirst();
}

export interface PublicLab {
  id: string;
  slug: string;
  name: string;
  networkCount: number;
}

/** Labs every signed-in person may read (the worked examples), with how many live networks each holds. */
export async function listPublicLabs(db: DbExecutor): Promise<PublicLab[]> {
  const rows = await db
    .selectFrom("labs as l")
    .select((eb) => [
      "l.id",
      "l.slug",
      "l.name",
      eb
        .selectFrom("networks as n")
        .select(eb.fn.countAll<string>().as("n"))
        .whereRef("n.lab_id", "=", "l.id")
        .where("n.archived_at", "is", null)
        .as("network_count"),
    ])
    .where("l.is_public", "=", true)
    .orderBy("l.name")
    .execute();
  return rows.map((r) => ({ id: r.id, slug: r.slug, name: r.name, networkCount: Number(r.network_count ?? 0) }));
}

/** How many live networks the labs a user belongs to hold together (0 → show the first steps). */
export async function countNetworksOf(db: DbExecutor, userId: string): Promise<number> {
  const row = await db
    .selectFrom("networks as n")
    .innerJoin("memberships as m", "m.lab_id", "n.lab_id")
    .select((eb) => eb.fn.countAll<string>().as("n"))
    .where("m.user_id", "=", userId)
    .where("n.archived_at", "is", null)
    .executeTakeFirstOrThrow();
  return Number(row.n);
}
