import { type Kysely, sql } from "kysely";

/**
 * The lifted candidate of a distributed basis as the proof batches use it, primitive over Z
 * (encodeIntegerCandidate in domain/algebra/f4/multimodular.ts), stored once per run beside its
 * text: each worker's task process loads it with its first proof batch instead of parsing the
 * text and making it primitive itself (app/jobs/basis-tasks.server.ts). Null for runs proven by
 * Hilbert series, whose batches need the text.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`ALTER TABLE basis_runs ADD COLUMN candidate_integer bytea`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`ALTER TABLE basis_runs DROP COLUMN candidate_integer`.execute(db);
}
