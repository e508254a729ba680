import { type Kysely, sql } from "kysely";

/**
 * Background analyses (issue 7): job bookkeeping on `analyses` (kind, parent, attempts,
 * heartbeat, cancellation flag, time limit, e-mail on finish), read-only share links for one
 * analysis, and each lab's maximum time limit and size budget. pg-boss keeps its own schema
 * (`pgboss`), created by the worker; this migration does not touch it.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    ALTER TABLE analyses
      ADD COLUMN kind text NOT NULL DEFAULT 'analysis' CHECK (kind IN ('analysis', 'scan', 'relation', 'timecourse')),
      ADD COLUMN parent_id uuid REFERENCES analyses (id) ON DELETE CASCADE,
      ADD COLUMN attempts integer NOT NULL DEFAULT 0 CHECK (attempts >= 0),
      ADD COLUMN max_attempts integer NOT NULL DEFAULT 2 CHECK (max_attempts >= 1),
      ADD COLUMN heartbeat_at timestamptz,
      ADD COLUMN worker_id text,
      ADD COLUMN cancel_requested_at timestamptz,
      ADD COLUMN time_limit_seconds integer NOT NULL DEFAULT 120 CHECK (time_limit_seconds BETWEEN 1 AND 86400),
      ADD COLUMN notify_by_email boolean NOT NULL DEFAULT false
  `.execute(db);
  await sql`CREATE INDEX analyses_parent_id_idx ON analyses (parent_id) WHERE parent_id IS NOT NULL`.execute(db);
  // The sweeper looks for running rows whose heartbeat went quiet.
  await sql`CREATE INDEX analyses_running_heartbeat_idx ON analyses (heartbeat_at) WHERE status = 'running'`.execute(db);

  await sql`
    CREATE TABLE analysis_share_links (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      analysis_id uuid NOT NULL REFERENCES analyses (id) ON DELETE CASCADE,
      token_hash text NOT NULL UNIQUE CHECK (token_hash ~ '^[0-9a-f]{64}$'),
      created_by uuid REFERENCES users (id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      expires_at timestamptz NOT NULL,
      revoked_at timestamptz
    )
  `.execute(db);
  await sql`CREATE INDEX analysis_share_links_analysis_id_idx ON analysis_share_links (analysis_id)`.execute(db);

  await sql`
    CREATE TABLE lab_analysis_settings (
      lab_id uuid PRIMARY KEY REFERENCES labs (id) ON DELETE CASCADE,
      max_time_limit_seconds integer NOT NULL DEFAULT 300 CHECK (max_time_limit_seconds BETWEEN 1 AND 3600),
      max_basis_size integer NOT NULL DEFAULT 5000 CHECK (max_basis_size BETWEEN 1 AND 1000000),
      updated_at timestamptz NOT NULL DEFAULT now()
    )
  `.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("lab_analysis_settings").execute();
  await db.schema.dropTable("analysis_share_links").execute();
  await sql`DROP INDEX IF EXISTS analyses_running_heartbeat_idx`.execute(db);
  await sql`DROP INDEX IF EXISTS analyses_parent_id_idx`.execute(db);
  await sql`
    ALTER TABLE analyses
      DROP COLUMN notify_by_email, DROP COLUMN time_limit_seconds, DROP COLUMN cancel_requested_at,
      DROP COLUMN worker_id, DROP COLUMN heartbeat_at, DROP COLUMN max_attempts, DROP COLUMN attempts,
      DROP COLUMN parent_id, DROP COLUMN kind
  `.execute(db);
}
