import { type Kysely, sql } from "kysely";

/**
 * Initial schema: accounts and labs, networks with immutable content-hashed versions,
 * analyses, API tokens and the audit trail. Imports no app code (migrations must stay runnable
 * as written, whatever the app later becomes).
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    CREATE FUNCTION stillpoint_touch_updated_at() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      NEW.updated_at := now();
      RETURN NEW;
    END $$;
  `.execute(db);

  await sql`
    CREATE TABLE users (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      email text NOT NULL CHECK (email = lower(email) AND email LIKE '%_@_%'),
      display_name text NOT NULL CHECK (length(display_name) <= 200),
      is_site_admin boolean NOT NULL DEFAULT false,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT users_email_key UNIQUE (email)
    )
  `.execute(db);

  await sql`
    CREATE TABLE labs (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      slug text NOT NULL CHECK (slug ~ '^[a-z0-9]+(-[a-z0-9]+)*$' AND length(slug) <= 64),
      name text NOT NULL CHECK (length(name) BETWEEN 1 AND 200),
      created_by uuid REFERENCES users (id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT labs_slug_key UNIQUE (slug)
    )
  `.execute(db);

  await sql`
    CREATE TABLE memberships (
      lab_id uuid NOT NULL REFERENCES labs (id) ON DELETE CASCADE,
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      role text NOT NULL CHECK (role IN ('owner', 'editor', 'viewer')),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT memberships_pkey PRIMARY KEY (lab_id, user_id)
    )
  `.execute(db);
  // "Which labs am I in?" is asked on every request.
  await sql`CREATE INDEX memberships_user_id_idx ON memberships (user_id)`.execute(db);

  await sql`
    CREATE TABLE invitations (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      lab_id uuid NOT NULL REFERENCES labs (id) ON DELETE CASCADE,
      email text NOT NULL CHECK (email = lower(email) AND email LIKE '%_@_%'),
      role text NOT NULL CHECK (role IN ('owner', 'editor', 'viewer')),
      token_hash text NOT NULL CHECK (token_hash ~ '^[0-9a-f]{64}$'),
      invited_by uuid REFERENCES users (id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      expires_at timestamptz NOT NULL,
      accepted_at timestamptz,
      accepted_by uuid REFERENCES users (id) ON DELETE SET NULL,
      revoked_at timestamptz,
      CONSTRAINT invitations_token_hash_key UNIQUE (token_hash),
      CONSTRAINT invitations_not_both_accepted_and_revoked CHECK (accepted_at IS NULL OR revoked_at IS NULL)
    )
  `.execute(db);
  await sql`CREATE INDEX invitations_lab_id_email_idx ON invitations (lab_id, email)`.execute(db);
  await sql`CREATE INDEX invitations_email_idx ON invitations (email)`.execute(db);

  await sql`
    CREATE TABLE networks (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      lab_id uuid NOT NULL REFERENCES labs (id) ON DELETE CASCADE,
      name text NOT NULL CHECK (length(name) BETWEEN 1 AND 200),
      description text NOT NULL DEFAULT '',
      tags text[] NOT NULL DEFAULT '{}',
      archived_at timestamptz,
      created_by uuid REFERENCES users (id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    )
  `.execute(db);
  await sql`CREATE INDEX networks_lab_id_created_at_idx ON networks (lab_id, created_at DESC)`.execute(db);
  await sql`CREATE INDEX networks_tags_idx ON networks USING gin (tags)`.execute(db);

  await sql`
    CREATE TABLE network_versions (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      network_id uuid NOT NULL REFERENCES networks (id) ON DELETE CASCADE,
      number integer NOT NULL CHECK (number >= 1),
      content_hash text NOT NULL CHECK (content_hash ~ '^[0-9a-f]{64}$'),
      csv text NOT NULL,
      change_note text NOT NULL DEFAULT '',
      author_id uuid REFERENCES users (id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT network_versions_network_id_number_key UNIQUE (network_id, number),
      CONSTRAINT network_versions_network_id_content_hash_key UNIQUE (network_id, content_hash)
    )
  `.execute(db);
  // Versions are immutable: only the author link may change (set to NULL when a user is deleted).
  await sql`
    CREATE FUNCTION stillpoint_network_versions_immutable() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF NEW.network_id IS DISTINCT FROM OLD.network_id OR NEW.number IS DISTINCT FROM OLD.number
         OR NEW.content_hash IS DISTINCT FROM OLD.content_hash OR NEW.csv IS DISTINCT FROM OLD.csv
         OR NEW.change_note IS DISTINCT FROM OLD.change_note OR NEW.created_at IS DISTINCT FROM OLD.created_at THEN
        RAISE EXCEPTION 'network versions are immutable (version %)', OLD.id USING ERRCODE = 'check_violation';
      END IF;
      RETURN NEW;
    END $$;
  `.execute(db);
  await sql`
    CREATE TRIGGER network_versions_immutable BEFORE UPDATE ON network_versions
    FOR EACH ROW EXECUTE FUNCTION stillpoint_network_versions_immutable()
  `.execute(db);

  await sql`
    CREATE TABLE analyses (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      network_version_id uuid NOT NULL REFERENCES network_versions (id) ON DELETE CASCADE,
      lab_id uuid NOT NULL REFERENCES labs (id) ON DELETE CASCADE,
      status text NOT NULL DEFAULT 'queued'
        CHECK (status IN ('queued', 'running', 'succeeded', 'failed', 'cancelled')),
      params jsonb NOT NULL DEFAULT '{}' CHECK (jsonb_typeof(params) = 'object'),
      result jsonb,
      error text,
      engine_version text NOT NULL,
      progress jsonb NOT NULL DEFAULT '{}' CHECK (jsonb_typeof(progress) = 'object'),
      timings jsonb NOT NULL DEFAULT '{}' CHECK (jsonb_typeof(timings) = 'object'),
      started_by uuid REFERENCES users (id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      started_at timestamptz,
      finished_at timestamptz
    )
  `.execute(db);
  await sql`CREATE INDEX analyses_lab_id_created_at_idx ON analyses (lab_id, created_at DESC)`.execute(db);
  await sql`CREATE INDEX analyses_network_version_id_idx ON analyses (network_version_id)`.execute(db);
  // The worker looks for unfinished work; keep that index small.
  await sql`
    CREATE INDEX analyses_unfinished_idx ON analyses (created_at) WHERE status IN ('queued', 'running')
  `.execute(db);

  await sql`
    CREATE TABLE api_tokens (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      name text NOT NULL CHECK (length(name) BETWEEN 1 AND 100),
      token_hash text NOT NULL CHECK (token_hash ~ '^[0-9a-f]{64}$'),
      created_at timestamptz NOT NULL DEFAULT now(),
      expires_at timestamptz,
      last_used_at timestamptz,
      revoked_at timestamptz,
      CONSTRAINT api_tokens_token_hash_key UNIQUE (token_hash)
    )
  `.execute(db);
  await sql`CREATE INDEX api_tokens_user_id_idx ON api_tokens (user_id)`.execute(db);

  await sql`
    CREATE TABLE audit_events (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      lab_id uuid REFERENCES labs (id) ON DELETE SET NULL,
      actor_id uuid REFERENCES users (id) ON DELETE SET NULL,
      kind text NOT NULL CHECK (kind ~ '^[a-z_]+([.][a-z_]+)*$'),
      details jsonb NOT NULL DEFAULT '{}' CHECK (jsonb_typeof(details) = 'object'),
      created_at timestamptz NOT NULL DEFAULT clock_timestamp()
    )
  `.execute(db);
  await sql`CREATE INDEX audit_events_lab_id_created_at_idx ON audit_events (lab_id, created_at DESC)`.execute(db);
  await sql`CREATE INDEX audit_events_actor_id_created_at_idx ON audit_events (actor_id, created_at DESC)`.execute(db);

  for (const table of ["users", "labs", "memberships", "networks"]) {
    await sql`
      CREATE TRIGGER ${sql.raw(`${table}_touch_updated_at`)} BEFORE UPDATE ON ${sql.table(table)}
      FOR EACH ROW EXECUTE FUNCTION stillpoint_touch_updated_at()
    `.execute(db);
  }
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const table of [
    "audit_events",
    "api_tokens",
    "analyses",
    "network_versions",
    "networks",
    "invitations",
    "memberships",
    "labs",
    "users",
  ]) {
    await db.schema.dropTable(table).execute();
  }
  await sql`DROP FUNCTION stillpoint_network_versions_immutable()`.execute(db);
  await sql`DROP FUNCTION stillpoint_touch_updated_at()`.execute(db);
}
