/** npm run seed — add the demo lab, people and networks, and the public worked examples (idempotent). Uses DATABASE_URL / DB_*. */
import { createDb } from "../app/db.server";
import { getEnv } from "../app/env.server";
import { seedDemo } from "../seeds/demo";
import { seedExamples } from "../seeds/examples";

export async function seed(databaseUrl: string) {
  const db = createDb(databaseUrl, { max: 1 });
  try {
    const summary = await seedDemo(db);
    console.log(
      `[seed] demo lab ready: ${summary.users} people, ${summary.networks} networks, ${summary.versionsAdded} new versions`,
    );
    const examples = await seedExamples(db);
    console.log(`[seed] public worked examples ready: ${examples.versionsAdded} new versions`);
    return summary;
  } finally {
    await db.destroy();
  }
}

if (process.argv[1]?.endsWith("scripts/seed.ts")) {
  seed(getEnv().databaseUrl).then(
    () => process.exit(0),
    (err) => {
      console.error("[seed] failed:", err instanceof Error ? err.message : err);
      process.exit(1);
    },
  );
}
