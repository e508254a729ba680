import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createDb, type PoolStats } from "~/db.server";
import { createTestDatabase, hasTestDatabase, type TestDatabase } from "../support/test-db";

/**
 * Under load a request queues for a free connection instead of failing (issue 16 #12: "timeout
 * exceeded when trying to connect"), and the pool counts how often that happened.
 */
describe.skipIf(!hasTestDatabase)("the web server's pool", () => {
  let t: TestDatabase;
  beforeAll(async () => {
    t = await createTestDatabase();
  });
  afterAll(async () => t?.drop());

  it("queues callers beyond `max` and serves every one of them, counting the queued", async () => {
    const stats: PoolStats = { max: 0, acquisitions: 0, queued: 0, queuedMsTotal: 0, maxWaitMs: 0, failed: 0 };
    const db = createDb(t.url, { max: 2, waitMs: 30_000, unavailableAsResponse: true, stats });
    try {
      // Eight queries that each hold a connection a while, on a pool of two.
      const answers = await Promise.all(Array.from({ length: 8 }, (_, i) => sql<{ n: number }>`SELECT ${i}::int AS n, pg_sleep(0.05)`.execute(db)));
      expect(answers.map((a) => a.rows[0]!.n)).toEqual([0, 1, 2, 3, 4, 5, 6, 7]);
      expect(stats.max).toBe(2);
      expect(stats.acquisitions).toBe(8);
      expect(stats.queued).toBeGreaterThanOrEqual(6);
      expect(stats.failed).toBe(0);
    } finally {
      await db.destroy();
    }
  });
});
