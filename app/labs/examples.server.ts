/**
 * The worked examples: a public lab every signed-in person reads as a guest, and copying its
 * networks into a lab of one's own, where they can be edited and analysed. Guests only read —
 * analyses run in the copier's lab, under that lab's limits and queue share, so one newcomer cannot
 * fill a shared lab with runs and everyone's runs stay in their own lab's list.
 */
import type { Kysely } from "kysely";
import type { Database } from "~/db/schema";
import { contentHash, listNetworks } from "~/networks/networks.server";
import { requestStructure } from "~/networks/structure-store.server";
import { hasRole } from "~/permissions/roles";
import { recordAudit } from "~/shared/audit.server";
import { createLab, listLabsOf } from "./labs.server";

export interface CopyOutcome {
  copied: string[];
  /** Names the target lab already has: those are left alone, never overwritten. */
  skipped: string[];
}

/**
 * Copies the live networks of `fromLabId` into `toLabId`, each as a new network whose version 1 is
 * the example's newest version (its note says which). Running it again copies nothing twice.
 */
export async function copyExamples(db: Kysely<Database>, args: { fromLabId: string; fromName: string; toLabId: string; actorId: string }): Promise<CopyOutcome> {
  return db.transaction().execute(async (trx) => {
    const examples = await listNetworks(trx, args.fromLabId);
    const present = new Set((await trx.selectFrom("networks").select("name").where("lab_id", "=", args.toLabId).execute()).map((r) => r.name));
    const outcome: CopyOutcome = { copied: [], skipped: [] };
    for (const ex of examples) {
      if (present.has(ex.name)) {
        outcome.skipped.push(ex.name);
        continue;
      }
      const { id } = await trx
        .insertInto("networks")
        .values({ lab_id: args.toLabId, name: ex.name, description: ex.description, tags: ex.tags, created_by: args.actorId })
        .returning("id")
        .executeTakeFirstOrThrow();
      await trx
        .insertInto("network_versions")
        .values({
          network_id: id,
          number: 1,
          content_hash: contentHash(ex.latest.csv),
          csv: ex.latest.csv,
          change_note: `Copied from ${args.fromName} (their version ${ex.latest.number}).`,
          author_id: args.actorId,
        })
        .execute();
      // Normally stored already (same content as the example); requested in case it is not.
      await requestStructure(trx, ex.latest.csv);
      outcome.copied.push(ex.name);
    }
    if (outcome.copied.length > 0)
      await recordAudit(trx, { kind: "examples.copied", actorId: args.actorId, labId: args.toLabId, details: { from: args.fromName, networks: outcome.copied } });
    return outcome;
  });
}

/**
 * Where "copy the examples into my lab" puts them: the preferred (working) lab when the user may
 * edit there, else their first lab they may edit; a person with no lab at all gets one of their
 * own, named after them. Null when they are in labs but may edit none of them.
 */
export async function labForCopy(db: Kysely<Database>, user: { id: string; displayName: string }, preferredSlug: string | undefined) {
  const labs = (await listLabsOf(db, user.id)).filter((l) => hasRole(l.role, "editor"));
  const lab = labs.find((l) => l.slug === preferredSlug) ?? labs[0];
  if (lab) return { id: lab.id, slug: lab.slug, name: lab.name };
  if ((await listLabsOf(db, user.id)).length > 0) return null;
  return createLab(db, { userId: user.id, name: `${user.displayName}’s lab` });
}
