import { type Kysely, sql } from "kysely";

/**
 * One row per counted action (a sign-in code request, an invitation e-mail) in a named bucket
 * ("code:address:<hmac>", "code:client:<key>", "invite:lab:<id>"). The app counts and inserts
 * in one transaction under an advisory lock per bucket, so parallel requests cannot all pass a
 * check that each of them made before any of them was recorded.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    CREATE TABLE rate_limit_events (
      id bigserial PRIMARY KEY,
      bucket text NOT NULL CHECK (length(bucket) BETWEEN 1 AND 200),
      created_at timestamptz NOT NULL DEFAULT clock_timestamp()
    )
  `.execute(db);
  await sql`CREATE INDEX rate_limit_events_bucket_created_at_idx ON rate_limit_events (bucket, created_at DESC)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("rate_limit_events").execute();
}
