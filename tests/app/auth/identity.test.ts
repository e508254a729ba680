import { Kysely, PostgresDialect } from "kysely";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Database } from "~/db/schema";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { makeLab, makeRequest, makeUser, sessionCookieFor, setUpAccountsDb, tearDownAccountsDb } from "./fixtures";

describe.skipIf(!hasTestDatabase)("who is asking, in one query (identity.server.ts)", () => {
  let t: TestDatabase;
  let counted: Kysely<Database>;
  let pool: pg.Pool;
  let queries = 0;
  let userId: string;

  beforeAll(async () => {
    t = await setUpAccountsDb();
    pool = new pg.Pool({ connectionString: t.url, max: 2 });
    // A second handle on the same database that counts the statements it sends.
    counted = new Kysely<Database>({ dialect: new PostgresDialect({ pool }), log: (e) => void (e.level === "query" && queries++) });
    userId = (await makeUser(t.db, "ines@lab.test", "Ines")).id;
    const other = (await makeUser(t.db, "olu@lab.test", "Olu")).id;
    await makeLab(t.db, "zeta-lab", "Zeta Lab", [[userId, "viewer"]]);
    await makeLab(t.db, "alpha-lab", "Alpha Lab", [[userId, "owner"], [other, "editor"]]);
    await makeLab(t.db, "not-hers", "Not Hers", [[other, "owner"]]);
  });
  afterAll(async () => {
    await counted?.destroy();
    await tearDownAccountsDb(t);
  });

  const identityOf = async (cookie: string | undefined) => {
    const { readIdentity } = await import("~/auth/identity.server");
    queries = 0;
    const identity = await readIdentity(counted, makeRequest("/", cookie === undefined ? {} : { cookie }));
    return { identity, queries };
  };

  it("reads the session, its user and the user's labs (alphabetically, with roles) in one query", async () => {
    const { identity, queries } = await identityOf(await sessionCookieFor(userId));
    expect(queries).toBe(1);
    expect(identity.user).toEqual({ id: userId, email: "ines@lab.test", displayName: "Ines", isSiteAdmin: false });
    expect(identity.session.userId).toBe(userId);
    expect(identity.labs.map((l) => [l.slug, l.name, l.role, l.isPublic])).toEqual([
      ["alpha-lab", "Alpha Lab", "owner", false],
      ["zeta-lab", "Zeta Lab", "viewer", false],
    ]);
  });

  it("asks the database nothing for a visitor without a cookie or with a forged one", async () => {
    expect(await identityOf(undefined)).toEqual({ identity: { session: {}, user: null, labs: [] }, queries: 0 });
    const [name, value] = (await sessionCookieFor(userId)).split("=");
    expect(await identityOf(`${name}=${value!.slice(0, -3)}xyz`)).toEqual({ identity: { session: {}, user: null, labs: [] }, queries: 0 });
  });

  it("a session ended by 'sign out everywhere' stays ended", async () => {
    const { destroyAllSessionsOf } = await import("~/auth/session.server");
    const cookie = await sessionCookieFor(userId);
    expect((await identityOf(cookie)).identity.user?.id).toBe(userId);
    await destroyAllSessionsOf(userId);
    const after = await identityOf(cookie);
    expect(after.identity.user).toBeNull();
    expect(after.identity.labs).toEqual([]);
  });

  it("an expired session counts as nobody", async () => {
    const cookie = await sessionCookieFor(userId);
    await t.db.updateTable("sessions").set({ expires_at: new Date(Date.now() - 1000) }).where("user_id", "=", userId).execute();
    expect((await identityOf(cookie)).identity.user).toBeNull();
  });

  it("a row whose user column disagrees with its data counts as nobody, not as either user", async () => {
    const cookie = await sessionCookieFor(userId);
    const other = await t.db.selectFrom("users").select("id").where("email", "=", "olu@lab.test").executeTakeFirstOrThrow();
    await t.db.updateTable("sessions").set({ user_id: other.id }).where("user_id", "=", userId).execute();
    const { identity } = await identityOf(cookie);
    expect(identity.user).toBeNull();
    expect(identity.labs).toEqual([]);
  });

  it("a page view's loaders share one look-up: the user and the lab role come from the same read", async () => {
    const { getIdentity, getOptionalUser, requireLabRole } = await import("~/permissions/permissions.server");
    const request = makeRequest("/labs/alpha-lab", { cookie: await sessionCookieFor(userId) });
    const first = getIdentity(request);
    expect(getIdentity(request)).toBe(first);
    expect((await getOptionalUser(request))?.id).toBe(userId);
    const access = await requireLabRole(request, "alpha-lab", "owner");
    expect(access.role).toBe("owner");
    expect(access.guest).toBe(false);
    // A write looks again every time (a sign-out earlier in the same request must count).
    const post = makeRequest("/labs/alpha-lab", { method: "POST", cookie: await sessionCookieFor(userId), form: {} });
    const [a, b] = [getIdentity(post), getIdentity(post)];
    expect(a).not.toBe(b);
    expect((await a).user?.id).toBe(userId);
    await b;
  });
});
