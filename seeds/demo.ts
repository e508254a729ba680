/**
 * Idempotent demo seed: running it twice leaves the database as after one run. People are
 * matched by e-mail, the lab by slug, networks by (lab, name), versions by content hash.
 */
import { createHash } from "node:crypto";
import type { Kysely, Transaction } from "kysely";
import type { Database } from "../app/db/schema";
import { DEMO_LAB, DEMO_NETWORKS, DEMO_PEOPLE, type DemoNetwork } from "./demo-data";
import { requestStructure } from "../app/networks/structure-store.server";

export function contentHash(csv: string): string {
  return createHash("sha256").update(csv, "utf8").digest("hex");
}

export interface SeedSummary {
  users: number;
  networks: number;
  versionsAdded: number;
}

export async function seedDemo(db: Kysely<Database>): Promise<SeedSummary> {
  return db.transaction().execute(async (trx) => {
    const userIds = new Map<string, string>();
    for (const person of DEMO_PEOPLE) {
      const row = await trx
        .insertInto("users")
        .values({ email: person.email, display_name: person.displayName, is_site_admin: person.isSiteAdmin ?? false })
        .onConflict((oc) => oc.column("email").doUpdateSet({ email: person.email }))
        .returning("id")
        .executeTakeFirstOrThrow();
      userIds.set(person.email, row.id);
    }

    const owner = DEMO_PEOPLE.find((p) => p.role === "owner")!;
    const lab = await trx
      .insertInto("labs")
      .values({ slug: DEMO_LAB.slug, name: DEMO_LAB.name, created_by: userIds.get(owner.email)! })
      .onConflict((oc) => oc.column("slug").doUpdateSet({ slug: DEMO_LAB.slug }))
      .returning("id")
      .executeTakeFirstOrThrow();

    for (const person of DEMO_PEOPLE) {
      if (!person.role) continue;
      await trx
        .insertInto("memberships")
        .values({ lab_id: lab.id, user_id: userIds.get(person.email)!, role: person.role })
        .onConflict((oc) => oc.columns(["lab_id", "user_id"]).doNothing())
        .execute();
    }

    const versionsAdded = await upsertNetworks(trx, lab.id, DEMO_NETWORKS, userIds);
    return { users: userIds.size, networks: DEMO_NETWORKS.length, versionsAdded };
  });
}

/**
 * Adds each network (matched by lab and name) and each of its versions (matched by content hash)
 * that is missing; returns how many versions were added. Authors not in `userIds` stay null.
 */
export async function upsertNetworks(trx: Transaction<Database>, labId: string, networks: readonly DemoNetwork[], userIds: ReadonlyMap<string, string>): Promise<number> {
  let versionsAdded = 0;
  for (const network of networks) {
    const firstAuthor = userIds.get(network.versions[0].author) ?? null;
    const existing = await trx
      .selectFrom("networks")
      .select("id")
      .where("lab_id", "=", labId)
      .where("name", "=", network.name)
      .executeTakeFirst();
    // A demo text that was corrected replaces its earlier wording, never a person's own text.
    if (existing && network.previousDescriptions?.length)
      await trx
        .updateTable("networks")
        .set({ description: network.description })
        .where("id", "=", existing.id)
        .where("description", "in", network.previousDescriptions)
        .execute();
    const networkId =
      existing?.id ??
      (
        await trx
          .insertInto("networks")
          .values({
            lab_id: labId,
            name: network.name,
            description: network.description,
            tags: network.tags,
            created_by: firstAuthor,
          })
          .returning("id")
          .executeTakeFirstOrThrow()
      ).id;

    for (const version of network.versions) {
      const hash = contentHash(version.csv);
      // Asked for up front, so the worker has the structures ready before anyone opens the page.
      await requestStructure(trx, version.csv);
      const present = await trx
        .selectFrom("network_versions")
        .select("id")
        .where("network_id", "=", networkId)
        .where("content_hash", "=", hash)
        .executeTakeFirst();
      if (present) continue;
      const { max } = await trx
        .selectFrom("network_versions")
        .select((eb) => eb.fn.max("number").as("max"))
        .where("network_id", "=", networkId)
        .executeTakeFirstOrThrow();
      await trx
        .insertInto("network_versions")
        .values({
          network_id: networkId,
          number: (max ?? 0) + 1,
          content_hash: hash,
          csv: version.csv,
          change_note: version.changeNote,
          author_id: userIds.get(version.author) ?? null,
        })
        .execute();
      versionsAdded++;
    }
  }
  return versionsAdded;
}
