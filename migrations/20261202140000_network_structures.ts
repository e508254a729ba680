import { type Kysely, sql } from "kysely";

/**
 * The structure of each distinct network file, keyed by its content hash (the same hash as
 * network_versions.content_hash): computed by the worker, never by the web server, which shows
 * "being computed" until the row is ready. `csv` is the file the worker computes from; `failed`
 * keeps the reason. A version never changes, so neither does its row once ready. `json`, not
 * `jsonb`: the text is kept as written, so the key order of conservation laws (how they read on
 * the page) survives.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    CREATE TABLE network_structures (
      content_hash text PRIMARY KEY CHECK (content_hash ~ '^[0-9a-f]{64}$'),
      csv text NOT NULL,
      status text NOT NULL DEFAULT 'pending' CHECK (status IN ('pending', 'computing', 'ready', 'failed')),
      structure json,
      problem text,
      requested_at timestamptz NOT NULL DEFAULT now(),
      claimed_at timestamptz,
      computed_at timestamptz,
      CHECK ((status = 'ready') = (structure IS NOT NULL))
    )
  `.execute(db);
  await sql`CREATE INDEX network_structures_open_idx ON network_structures (requested_at) WHERE status IN ('pending', 'computing')`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("network_structures").execute();
}
