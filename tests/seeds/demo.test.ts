import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/parse-csv";
import { DEMO_LAB, DEMO_NETWORKS, DEMO_PEOPLE } from "../../seeds/demo-data";
import { contentHash, seedDemo } from "../../seeds/demo";
import { createTestDatabase, hasTestDatabase, type TestDatabase } from "../app/support/test-db";

describe("demo networks", () => {
  it.each(DEMO_NETWORKS.flatMap((n) => n.versions.map((v, i) => [`${n.name} v${i + 1}`, v.csv] as const)))(
    "%s is a valid network file",
    (_name, csv) => {
      const network = parseNetworkCsv(csv);
      expect(network.species.length + (network.constants?.length ?? 0)).toBeGreaterThan(1);
    },
  );

  it("uses only reserved .test addresses", () => {
    for (const p of DEMO_PEOPLE) expect(p.email).toMatch(/^[a-z]+@[a-z]+\.test$/);
  });

  it("hashes content with SHA-256 hex (FIPS 180-4 test vector 'abc')", () => {
    expect(contentHash("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });
});

describe.skipIf(!hasTestDatabase)("seedDemo", () => {
  let t: TestDatabase;
  beforeAll(async () => {
    t = await createTestDatabase();
  });
  afterAll(async () => {
    await t?.drop();
  });

  async function counts() {
    const n = async (table: "users" | "labs" | "memberships" | "networks" | "network_versions") =>
      Number((await t.db.selectFrom(table).select((eb) => eb.fn.countAll().as("n")).executeTakeFirstOrThrow()).n);
    return {
      users: await n("users"),
      labs: await n("labs"),
      memberships: await n("memberships"),
      networks: await n("networks"),
      versions: await n("network_versions"),
    };
  }

  it("creates the lab, one member per role and every version", async () => {
    const summary = await seedDemo(t.db);
    const totalVersions = DEMO_NETWORKS.reduce((s, n) => s + n.versions.length, 0);
    expect(summary.versionsAdded).toBe(totalVersions);
    expect(await counts()).toEqual({
      users: DEMO_PEOPLE.length,
      labs: 1,
      memberships: 3,
      networks: DEMO_NETWORKS.length,
      versions: totalVersions,
    });
    const roles = await t.db
      .selectFrom("memberships")
      .innerJoin("users", "users.id", "memberships.user_id")
      .innerJoin("labs", "labs.id", "memberships.lab_id")
      .select(["users.email", "memberships.role", "labs.slug"])
      .orderBy("users.email")
      .execute();
    expect(roles).toEqual([
      { email: "editor@halvorsen.test", role: "editor", slug: DEMO_LAB.slug },
      { email: "owner@halvorsen.test", role: "owner", slug: DEMO_LAB.slug },
      { email: "viewer@halvorsen.test", role: "viewer", slug: DEMO_LAB.slug },
    ]);
  });

  it("numbers versions 1, 2, … and stores the hash of the exact CSV text", async () => {
    const rows = await t.db
      .selectFrom("network_versions")
      .innerJoin("networks", "networks.id", "network_versions.network_id")
      .select(["networks.name", "network_versions.number", "network_versions.csv", "network_versions.content_hash"])
      .orderBy("networks.name")
      .orderBy("network_versions.number")
      .execute();
    for (const row of rows) expect(row.content_hash).toBe(contentHash(row.csv));
    const cycle = rows.filter((r) => r.name === "Kinase–phosphatase cycle");
    expect(cycle.map((r) => r.number)).toEqual([1, 2]);
    expect(cycle[1].csv).toContain("S1F -> S0 + F");
  });

  it("is idempotent", async () => {
    const before = await counts();
    const again = await seedDemo(t.db);
    expect(again.versionsAdded).toBe(0);
    expect(await counts()).toEqual(before);
  });

  it("replaces a demo's earlier description on a re-seed, never a text a person wrote", async () => {
    const demo = DEMO_NETWORKS.find((n) => n.previousDescriptions?.length)!;
    const describe = (text: string) => t.db.updateTable("networks").set({ description: text }).where("name", "=", demo.name).execute();
    const current = async () => (await t.db.selectFrom("networks").select("description").where("name", "=", demo.name).executeTakeFirstOrThrow()).description;
    await describe(demo.previousDescriptions![0]!);
    await seedDemo(t.db);
    expect(await current()).toBe(demo.description);
    await describe("Our own notes on this reactor.");
    await seedDemo(t.db);
    expect(await current()).toBe("Our own notes on this reactor.");
  });
});
