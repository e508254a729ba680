import { type Kysely, sql } from "kysely";

/**
 * Runs one can keep track of: a name and a note on each analysis, archiving (hidden from the list
 * by default), and the parts of a run already computed when it was cancelled or stopped by its time
 * limit (`partial_result`, written by the worker as stages finish; `result` stays the finished answer only).
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    ALTER TABLE analyses
      ADD COLUMN name text NOT NULL DEFAULT '' CHECK (length(name) <= 120),
      ADD COLUMN note text NOT NULL DEFAULT '' CHECK (length(note) <= 4000),
      ADD COLUMN archived_at timestamptz,
      ADD COLUMN partial_result jsonb CHECK (partial_result IS NULL OR jsonb_typeof(partial_result) = 'object')
  `.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`ALTER TABLE analyses DROP COLUMN partial_result, DROP COLUMN archived_at, DROP COLUMN note, DROP COLUMN name`.execute(db);
}
