/** `npx tsx scripts/db/up.ts`: start the local PostgreSQL and leave it running (stop with down.ts). */
import { getEnv } from "../../app/env.server";
import { startLocalDatabase } from "./local";

await startLocalDatabase(getEnv());
console.log(`[db] ${getEnv().databaseUrl}`);
