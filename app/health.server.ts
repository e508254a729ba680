import type { Kysely } from "kysely";
import { sql } from "kysely";
import { migrationState } from "./db/migrator.server";

export interface Health {
  ok: boolean;
  version: string;
  database: { reachable: boolean; error?: string };
  migrations: { current: boolean; applied: number; pending: string[] };
}

/** Is the database reachable and fully migrated? Never throws: a failure is part of the answer. */
export async function checkHealth(db: Kysely<any>, version: string): Promise<Health> {
  try {
    await sql`SELECT 1`.execute(db);
  } catch (err) {
    return {
      ok: false,
      version,
      database: { reachable: false, error: err instanceof Error ? err.message : err instanceof Response ? "cannot connect" : String(err) },
      migrations: { current: false, applied: 0, pending: [] },
    };
  }
  const state = await migrationState(db);
  const current = state.pending.length === 0;
  return {
    ok: current,
    version,
    database: { reachable: true },
    migrations: { current, applied: state.applied.length, pending: state.pending },
  };
}
