import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_NETWORKS } from "../../seeds/demo-data";
import { EXAMPLE_LAB, seedExamples } from "../../seeds/examples";
import { createTestDatabase, hasTestDatabase, type TestDatabase } from "../app/support/test-db";

describe.skipIf(!hasTestDatabase)("seedExamples", () => {
  let t: TestDatabase;
  beforeAll(async () => {
    t = await createTestDatabase();
  });
  afterAll(async () => {
    await t?.drop();
  });

  const state = async () => ({
    lab: await t.db.selectFrom("labs").select(["slug", "name", "is_public"]).where("slug", "=", EXAMPLE_LAB.slug).executeTakeFirst(),
    members: Number((await t.db.selectFrom("memberships").select((eb) => eb.fn.countAll().as("n")).executeTakeFirstOrThrow()).n),
    networks: (await t.db.selectFrom("networks").select("name").orderBy("name").execute()).map((r) => r.name),
    versions: Number((await t.db.selectFrom("network_versions").select((eb) => eb.fn.countAll().as("n")).executeTakeFirstOrThrow()).n),
  });

  it("makes a public lab without members holding every demo network and version", async () => {
    const summary = await seedExamples(t.db);
    const totalVersions = DEMO_NETWORKS.reduce((s, n) => s + n.versions.length, 0);
    expect(summary.versionsAdded).toBe(totalVersions);
    expect(await state()).toEqual({
      lab: { slug: EXAMPLE_LAB.slug, name: EXAMPLE_LAB.name, is_public: true },
      members: 0,
      networks: DEMO_NETWORKS.map((n) => n.name).sort(),
      versions: totalVersions,
    });
  });

  it("is idempotent", async () => {
    const before = await state();
    expect((await seedExamples(t.db)).versionsAdded).toBe(0);
    expect(await state()).toEqual(before);
  });
});
