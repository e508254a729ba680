import { type Kysely, sql } from "kysely";

/**
 * Server-side state for sign-in: sessions (so sign-out and "sign out everywhere" really end a
 * session) and the ledger of e-mailed sign-in codes (single use, attempt limits, rate limits).
 * remix-auth-totp itself keeps its state in a browser cookie, which a client could replay.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    CREATE TABLE sessions (
      id_hash text PRIMARY KEY CHECK (id_hash ~ '^[0-9a-f]{64}$'),
      user_id uuid REFERENCES users (id) ON DELETE CASCADE,
      data jsonb NOT NULL DEFAULT '{}' CHECK (jsonb_typeof(data) = 'object'),
      created_at timestamptz NOT NULL DEFAULT now(),
      expires_at timestamptz NOT NULL
    )
  `.execute(db);
  // "Sign out everywhere" deletes by user; the sweep deletes by expiry.
  await sql`CREATE INDEX sessions_user_id_idx ON sessions (user_id)`.execute(db);
  await sql`CREATE INDEX sessions_expires_at_idx ON sessions (expires_at)`.execute(db);

  await sql`
    CREATE TABLE login_codes (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      email text NOT NULL CHECK (email = lower(email)),
      code_hash text NOT NULL CHECK (code_hash ~ '^[0-9a-f]{64}$'),
      link_hash text NOT NULL CHECK (link_hash ~ '^[0-9a-f]{64}$'),
      client_key text NOT NULL,
      created_at timestamptz NOT NULL DEFAULT clock_timestamp(),
      expires_at timestamptz NOT NULL,
      attempts integer NOT NULL DEFAULT 0 CHECK (attempts >= 0),
      consumed_at timestamptz,
      invalidated_at timestamptz,
      CONSTRAINT login_codes_link_hash_key UNIQUE (link_hash)
    )
  `.execute(db);
  // Rate limits count recent requests per address and per client.
  await sql`CREATE INDEX login_codes_email_created_at_idx ON login_codes (email, created_at DESC)`.execute(db);
  await sql`CREATE INDEX login_codes_client_key_created_at_idx ON login_codes (client_key, created_at DESC)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("login_codes").execute();
  await db.schema.dropTable("sessions").execute();
}
