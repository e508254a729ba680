import { type Kysely, sql } from "kysely";

/**
 * The F4 run a distributed basis' coordinator learnt at its first prime (encodeImageTrace in
 * domain/algebra/f4/multimodular.ts), stored once per run: each worker's task process loads it
 * and replays it at its primes instead of learning the same run again (app/jobs/task-child.ts).
 * Null when the coordinator has none (its first image came from a task, or the run cannot be traced).
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`ALTER TABLE basis_runs ADD COLUMN trace bytea`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`ALTER TABLE basis_runs DROP COLUMN trace`.execute(db);
}
