/**
 * The public lab of worked examples: no members, readable by every signed-in person as a guest
 * (labs.is_public), holding the demo networks with their version histories. Idempotent like the
 * demo seed: the lab is matched by slug, networks by name, versions by content hash.
 */
import type { Kysely } from "kysely";
import type { Database } from "../app/db/schema";
import { DEMO_NETWORKS } from "./demo-data";
import { upsertNetworks } from "./demo";
import { EXAMPLE_LAB } from "../app/labs/example-lab";

export { EXAMPLE_LAB };

export async function seedExamples(db: Kysely<Database>): Promise<{ labId: string; versionsAdded: number }> {
  return db.transaction().execute(async (trx) => {
    const lab = await trx
      .insertInto("labs")
      .values({ slug: EXAMPLE_LAB.slug, name: EXAMPLE_LAB.name, is_public: true })
      .onConflict((oc) => oc.column("slug").doUpdateSet({ is_public: true }))
      .returning("id")
      .executeTakeFirstOrThrow();
    // No authors: the examples belong to nobody in particular (pages show them as worked examples).
    const versionsAdded = await upsertNetworks(trx, lab.id, DEMO_NETWORKS, new Map());
    return { labId: lab.id, versionsAdded };
  });
}
