/** `npx tsx scripts/db/down.ts`: stop the local PostgreSQL started by up.ts. */
import { getEnv } from "../../app/env.server";
import { findPgBin, initCluster, stopCluster } from "./postgres";

const env = getEnv();
const bin = findPgBin();
if (bin) stopCluster(bin, initCluster(bin, env.pgClusterDir, env.db.port));
