import { type Kysely, sql } from "kysely";

/**
 * A lab every signed-in person may read as a viewer without being a member (the worked examples).
 * Guests never see its members or audit log, and never write: the permission layer gives them the
 * viewer role and nothing more.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`ALTER TABLE labs ADD COLUMN is_public boolean NOT NULL DEFAULT false`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`ALTER TABLE labs DROP COLUMN is_public`.execute(db);
}
