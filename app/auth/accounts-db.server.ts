import type { Kysely } from "kysely";
import { db } from "~/db.server";
import type { Database } from "~/db/schema";

/** The shared Kysely instance (sessions and login_codes are part of `Database`). */
export function accountsDb(): Kysely<Database> {
  return db();
}
