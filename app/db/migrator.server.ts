import { type Kysely, type MigrationResultSet, Migrator } from "kysely";
import { migrations } from "../../migrations";

/** A Kysely Migrator over the static migration list in migrations/index.ts. */
export function createMigrator(db: Kysely<any>): Migrator {
  return new Migrator({ db, provider: { getMigrations: async () => migrations } });
}

export interface MigrationState {
  /** Names of migrations already applied, oldest first. */
  applied: string[];
  /** Names known to this build but not yet applied. */
  pending: string[];
}

/** What is applied and what is pending (read-only; creates the bookkeeping tables if missing). */
export async function migrationState(db: Kysely<any>): Promise<MigrationState> {
  const infos = await createMigrator(db).getMigrations();
  return {
    applied: infos.filter((m) => m.executedAt !== undefined).map((m) => m.name),
    pending: infos.filter((m) => m.executedAt === undefined).map((m) => m.name),
  };
}

/** Throws with the failing migration's name and cause; otherwise returns what ran. */
export function assertMigrationsOk(resultSet: MigrationResultSet): string[] {
  const { error, results = [] } = resultSet;
  if (error) {
    const failed = results.find((r) => r.status === "Error")?.migrationName ?? "(unknown)";
    const cause = error instanceof Error ? error.message : String(error);
    throw new Error(`Migration ${failed} failed: ${cause}`, { cause: error });
  }
  return results.filter((r) => r.status === "Success").map((r) => `${r.direction} ${r.migrationName}`);
}
