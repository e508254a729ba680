import { afterAll, beforeAll, describe, expect, it } from "vitest";
import pkg from "../../../../package.json";
import { createTestDatabase, hasTestDatabase, type TestDatabase } from "../../support/test-db";

// The route reads DATABASE_URL through the env module on first use, so point it at a
// migrated copy before importing the route.
describe.skipIf(!hasTestDatabase)("GET /api/health (route loader)", () => {
  let t: TestDatabase;
  beforeAll(async () => {
    t = await createTestDatabase();
    process.env.DATABASE_URL = t.url;
  });
  afterAll(async () => {
    const { closeDb } = await import("~/db.server");
    await closeDb();
    await t?.drop();
  });

  it("answers 200 with the app version, a reachable database and current migrations", async () => {
    const { loader } = await import("~/routes/api/health");
    const response = await loader();
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toMatch(/application\/json/);
    const body = await response.json();
    expect(body.version).toBe(pkg.version);
    expect(body.database.reachable).toBe(true);
    expect(body.migrations.current).toBe(true);
    expect(body.migrations.pending).toEqual([]);
  });
});
