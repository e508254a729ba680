import type { Kysely } from "kysely";
import type { Database } from "~/db/schema";

/** Every account, newest first, with how many labs each belongs to. For site administrators. */
export async function listAllUsers(db: Kysely<Database>) {
  const rows = await db
    .selectFrom("users as u")
    .select((eb) => [
      "u.id",
      "u.email",
      "u.display_name",
      "u.is_site_admin",
      "u.created_at",
      eb.selectFrom("memberships as m").select(eb.fn.countAll<string>().as("n")).whereRef("m.user_id", "=", "u.id").as("lab_count"),
    ])
    .orderBy("u.created_at", "desc")
    .execute();
  return rows.map((r) => ({
    id: r.id,
    email: r.email,
    displayName: r.display_name,
    isSiteAdmin: r.is_site_admin,
    createdAt: r.created_at,
    labCount: Number(r.lab_count ?? 0),
  }));
}

/** Every lab with its member and network counts (names only — not the lab's contents). */
export async function listAllLabs(db: Kysely<Database>) {
  const rows = await db
    .selectFrom("labs as l")
    .select((eb) => [
      "l.id",
      "l.slug",
      "l.name",
      "l.created_at",
      eb.selectFrom("memberships as m").select(eb.fn.countAll<string>().as("n")).whereRef("m.lab_id", "=", "l.id").as("member_count"),
      eb.selectFrom("networks as n").select(eb.fn.countAll<string>().as("n")).whereRef("n.lab_id", "=", "l.id").as("network_count"),
    ])
    .orderBy("l.name")
    .execute();
  return rows.map((r) => ({
    id: r.id,
    slug: r.slug,
    name: r.name,
    createdAt: r.created_at,
    memberCount: Number(r.member_count ?? 0),
    networkCount: Number(r.network_count ?? 0),
  }));
}
