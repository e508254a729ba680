import { createHash } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestDatabase, hasTestDatabase, type TestDatabase } from "../support/test-db";

const sha = (s: string) => createHash("sha256").update(s).digest("hex");

describe.skipIf(!hasTestDatabase)("schema constraints", () => {
  let t: TestDatabase;
  let userId: string;
  let labId: string;
  let networkId: string;

  beforeAll(async () => {
    t = await createTestDatabase();
    userId = (
      await t.db.insertInto("users").values({ email: "ada@lab.test", display_name: "Ada" }).returning("id").executeTakeFirstOrThrow()
    ).id;
    labId = (await t.db.insertInto("labs").values({ slug: "kinetics", name: "Kinetics" }).returning("id").executeTakeFirstOrThrow()).id;
    networkId = (
      await t.db.insertInto("networks").values({ lab_id: labId, name: "MM", created_by: userId }).returning("id").executeTakeFirstOrThrow()
    ).id;
  });
  afterAll(async () => {
    await t?.drop();
  });

  it("refuses upper-case and duplicate e-mail addresses", async () => {
    await expect(t.db.insertInto("users").values({ email: "Ada@lab.test", display_name: "A" }).execute()).rejects.toThrow(
      /users_email_check/,
    );
    await expect(t.db.insertInto("users").values({ email: "ada@lab.test", display_name: "A" }).execute()).rejects.toThrow(
      /users_email_key/,
    );
  });

  it("refuses a second membership for the same lab and user, and unknown roles", async () => {
    await t.db.insertInto("memberships").values({ lab_id: labId, user_id: userId, role: "owner" }).execute();
    await expect(
      t.db.insertInto("memberships").values({ lab_id: labId, user_id: userId, role: "viewer" }).execute(),
    ).rejects.toThrow(/memberships_pkey/);
    await expect(
      t.db.insertInto("memberships").values({ lab_id: labId, user_id: userId, role: "admin" as never }).execute(),
    ).rejects.toThrow(/memberships_role_check/);
  });

  it("keeps network versions unique per number and per content, and immutable", async () => {
    const csv = "reaction,label,rate,rate_value\nA -> B,k1,k1,1\n";
    const v = await t.db
      .insertInto("network_versions")
      .values({ network_id: networkId, number: 1, content_hash: sha(csv), csv, author_id: userId })
      .returning(["id", "created_at"])
      .executeTakeFirstOrThrow();
    expect(v.created_at).toBeInstanceOf(Date);
    await expect(
      t.db.insertInto("network_versions").values({ network_id: networkId, number: 2, content_hash: sha(csv), csv }).execute(),
    ).rejects.toThrow(/network_versions_network_id_content_hash_key/);
    await expect(
      t.db.insertInto("network_versions").values({ network_id: networkId, number: 1, content_hash: sha("x"), csv: "x" }).execute(),
    ).rejects.toThrow(/network_versions_network_id_number_key/);
    await expect(
      t.db.updateTable("network_versions").set({ csv: "tampered" }).where("id", "=", v.id).execute(),
    ).rejects.toThrow(/immutable/);
    // Deleting the author only unlinks it.
    const other = await t.db.insertInto("users").values({ email: "tmp@lab.test", display_name: "Tmp" }).returning("id").executeTakeFirstOrThrow();
    const csv2 = csv + "B -> C,k2,k2,2\n";
    await t.db.insertInto("network_versions").values({ network_id: networkId, number: 2, content_hash: sha(csv2), csv: csv2, author_id: other.id }).execute();
    await t.db.deleteFrom("users").where("id", "=", other.id).execute();
    const row = await t.db.selectFrom("network_versions").select("author_id").where("number", "=", 2).executeTakeFirstOrThrow();
    expect(row.author_id).toBeNull();
  });

  it("stores analysis JSON and refuses unknown statuses", async () => {
    const version = await t.db.selectFrom("network_versions").select("id").where("number", "=", 1).executeTakeFirstOrThrow();
    const a = await t.db
      .insertInto("analyses")
      .values({ network_version_id: version.id, lab_id: labId, engine_version: "0.1.0", params: { order: "lex" } })
      .returningAll()
      .executeTakeFirstOrThrow();
    expect(a.status).toBe("queued");
    expect(a.params).toEqual({ order: "lex" });
    expect(a.result).toBeNull();
    await expect(
      t.db.updateTable("analyses").set({ status: "exploded" as never }).where("id", "=", a.id).execute(),
    ).rejects.toThrow(/analyses_status_check/);
  });

  it("bumps updated_at on update", async () => {
    const before = await t.db.selectFrom("labs").select("updated_at").where("id", "=", labId).executeTakeFirstOrThrow();
    await new Promise((r) => setTimeout(r, 20));
    await t.db.updateTable("labs").set({ name: "Kinetics 2" }).where("id", "=", labId).execute();
    const after = await t.db.selectFrom("labs").select("updated_at").where("id", "=", labId).executeTakeFirstOrThrow();
    expect(after.updated_at.getTime()).toBeGreaterThan(before.updated_at.getTime());
  });
});
