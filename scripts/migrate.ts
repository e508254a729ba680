/**
 * npm run migrate            apply every pending migration (default)
 * npm run migrate -- down    undo the most recent migration
 * npm run migrate -- status  list applied and pending migrations
 * Uses DATABASE_URL (or DB_*; see app/env.server.ts). Exits non-zero on any failure.
 */
import { createDb } from "../app/db.server";
import { assertMigrationsOk, createMigrator, migrationState } from "../app/db/migrator.server";
import { getEnv } from "../app/env.server";

export async function migrate(databaseUrl: string, command: "latest" | "down" | "status" = "latest") {
  const db = createDb(databaseUrl, { max: 1 });
  try {
    if (command === "status") {
      const state = await migrationState(db);
      for (const name of state.applied) console.log(`applied  ${name}`);
      for (const name of state.pending) console.log(`pending  ${name}`);
      return state;
    }
    const migrator = createMigrator(db);
    const ran = assertMigrationsOk(command === "down" ? await migrator.migrateDown() : await migrator.migrateToLatest());
    console.log(ran.length === 0 ? "migrations: nothing to do" : ran.map((r) => `migrations: ${r}`).join("\n"));
    return await migrationState(db);
  } finally {
    await db.destroy();
  }
}

const isMain = import.meta.url === `file://${process.argv[1]}` || process.argv[1]?.endsWith("scripts/migrate.ts");
if (isMain) {
  const arg = process.argv[2] ?? "latest";
  const command = arg === "up" ? "latest" : arg;
  if (command !== "latest" && command !== "down" && command !== "status") {
    console.error(`Unknown command "${arg}". Use: up | down | status`);
    process.exit(2);
  }
  migrate(getEnv().databaseUrl, command).then(
    () => process.exit(0),
    (err) => {
      console.error(err instanceof Error ? err.message : err);
      process.exit(1);
    },
  );
}
