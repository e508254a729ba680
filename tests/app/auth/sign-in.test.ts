import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { cookiesFrom, makeRequest, makeUser, run, setUpAccountsDb, tearDownAccountsDb } from "./fixtures";

/**
 * The e-mailed code sign-in end to end through the route modules, with mail captured in memory:
 * remix-auth-totp generates, mails and checks the code; our ledger makes it single-use,
 * expiring, attempt-limited and rate-limited.
 */
describe.skipIf(!hasTestDatabase)("sign-in with an e-mailed code", () => {
  let t: TestDatabase;
  let outbox: { to: string; subject: string; text: string }[];
  let restoreMail: () => void;
  let signIn: typeof import("~/routes/sign-in");
  let verify: typeof import("~/routes/sign-in-verify");
  let magic: typeof import("~/routes/sign-in-magic");
  let welcome: typeof import("~/routes/welcome");
  let account: typeof import("~/routes/account");
  let policy: typeof import("~/auth/login-codes.server").SIGN_IN_POLICY;

  beforeAll(async () => {
    t = await setUpAccountsDb();
    const mailer = await import("~/mail/mailer.server");
    const captured = mailer.captureMail();
    outbox = captured.outbox;
    restoreMail = captured.restore;
    signIn = await import("~/routes/sign-in");
    verify = await import("~/routes/sign-in-verify");
    magic = await import("~/routes/sign-in-magic");
    welcome = await import("~/routes/welcome");
    account = await import("~/routes/account");
    policy = (await import("~/auth/login-codes.server")).SIGN_IN_POLICY;
    await makeUser(t.db, "known@lab.test", "Known Person");
  });
  afterAll(async () => {
    restoreMail?.();
    await tearDownAccountsDb(t);
  });
  beforeEach(async () => {
    outbox.length = 0;
    await t.db.deleteFrom("login_codes").execute();
    await t.db.deleteFrom("rate_limit_events").execute();
  });
  afterEach(() => {
    vi.useRealTimers();
  });

  /** Step 1 as a browser does it; returns the cookies, the code and the magic link from the mail. */
  async function requestCode(email: string, extra: { cookie?: string; returnTo?: string; client?: string; forwardedFor?: string } = {}) {
    const out = await run(
      signIn.action,
      makeRequest("/sign-in", {
        form: { email, returnTo: extra.returnTo ?? "/labs" },
        cookie: extra.cookie,
        headers: extra.forwardedFor ? { "X-Forwarded-For": extra.forwardedFor } : {},
      }),
      {},
      // The address the server puts in the load context (scripts/serve.ts, after TRUST_PROXY).
      extra.client ? { clientAddress: extra.client } : {},
    );
    const mail = outbox.at(-1);
    const code = mail && /sign-in code is ([A-Z0-9]{6})/.exec(mail.text)?.[1];
    const link = mail && /(http\S+\/sign-in\/magic\?t=\S+)/.exec(mail.text)?.[1];
    return { out, cookie: out.response ? cookiesFrom(out.response, extra.cookie) : (extra.cookie ?? ""), code, link, mail };
  }

  async function typeCode(cookie: string, code: string) {
    const out = await run(verify.action, makeRequest("/sign-in/verify", { form: { code }, cookie }));
    return { out, cookie: out.response ? cookiesFrom(out.response, cookie) : cookie };
  }

  async function signedInAs(cookie: string): Promise<string | null> {
    const out = await run(account.loader, makeRequest("/account", { cookie }));
    return out.status === 200 ? (out.body as { user: { email: string } }).user.email : null;
  }

  it("mails a code and a magic link, and redirects to the code page", async () => {
    const { out, cookie, code, link, mail } = await requestCode("Known@Lab.test");
    expect(out.status).toBe(302);
    expect(out.location).toBe("/sign-in/verify");
    expect(mail?.to).toBe("known@lab.test");
    expect(code).toMatch(/^[A-HJ-NP-Z2-9]{6}$/);
    expect(link).toMatch(/^http:\/\/127\.0\.0\.1:3999\/sign-in\/magic\?t=/);
    expect(cookie).toMatch(/_totp=/);
    const page = await run(verify.loader, makeRequest("/sign-in/verify", { cookie }));
    expect(page.status).toBe(200);
    expect((page.body as { email: string }).email).toBe("known@lab.test");
  });

  it("signs a known user in with the code (lower-case typing accepted) and records the sign-in", async () => {
    const first = await requestCode("known@lab.test", { returnTo: "/account" });
    const done = await typeCode(first.cookie, ` ${first.code!.toLowerCase()} `);
    expect(done.out.status).toBe(302);
    expect(done.out.location).toBe("/account");
    expect(await signedInAs(done.cookie)).toBe("known@lab.test");
    const events = await t.db.selectFrom("audit_events").select("kind").where("kind", "=", "auth.signed_in").execute();
    expect(events.length).toBeGreaterThan(0);
  });

  it("asks a first-time address for a display name, then creates the account", async () => {
    const first = await requestCode("newcomer@lab.test");
    const done = await typeCode(first.cookie, first.code!);
    expect(done.out.location).toBe("/welcome");
    expect(await t.db.selectFrom("users").select("id").where("email", "=", "newcomer@lab.test").executeTakeFirst()).toBeUndefined();
    expect(await signedInAs(done.cookie)).toBeNull();

    const page = await run(welcome.loader, makeRequest("/welcome", { cookie: done.cookie }));
    expect(page.body).toEqual({ email: "newcomer@lab.test" });
    const empty = await run(welcome.action, makeRequest("/welcome", { form: { displayName: "  " }, cookie: done.cookie }));
    expect(empty.status).toBe(400);
    const named = await run(welcome.action, makeRequest("/welcome", { form: { displayName: "Nora  Newcomer" }, cookie: done.cookie }));
    expect(named.status).toBe(302);
    const cookie = cookiesFrom(named.response!, done.cookie);
    expect(await signedInAs(cookie)).toBe("newcomer@lab.test");
    const user = await t.db.selectFrom("users").select("display_name").where("email", "=", "newcomer@lab.test").executeTakeFirstOrThrow();
    expect(user.display_name).toBe("Nora Newcomer");
  });

  it("answers known and unknown addresses identically", async () => {
    const known = await requestCode("known@lab.test");
    const unknown = await requestCode("nobody-here@lab.test");
    expect(unknown.out.status).toBe(known.out.status);
    expect(unknown.out.location).toBe(known.out.location);
    expect(unknown.mail!.subject.replace(unknown.code!, "X")).toBe(known.mail!.subject.replace(known.code!, "X"));
    expect(unknown.mail!.text.replace(unknown.code!, "X").replace(/t=\S+/, "")).toBe(known.mail!.text.replace(known.code!, "X").replace(/t=\S+/, ""));
    const pages = await Promise.all([known, unknown].map((r) => run(verify.loader, makeRequest("/sign-in/verify", { cookie: r.cookie }))));
    expect(Object.keys(pages[0]!.body as object)).toEqual(Object.keys(pages[1]!.body as object));
  });

  it("accepts a code only once", async () => {
    const first = await requestCode("known@lab.test");
    const ok = await typeCode(first.cookie, first.code!);
    expect(ok.out.status).toBe(302);
    // Replaying the same browser state (the old _totp cookie) and the same code.
    const again = await typeCode(first.cookie, first.code!);
    expect(again.out.status).toBe(400);
    expect((again.out.body as { error: string }).error).toMatch(/expired or was already used/);
    expect(await signedInAs(again.cookie)).toBeNull();
  });

  it(`locks a code after ${5} wrong attempts, even if the right one follows`, async () => {
    const first = await requestCode("known@lab.test");
    const wrong = first.code === "AAAAAA" ? "BBBBBB" : "AAAAAA";
    for (let i = policy.maxWrongAttempts - 1; i >= 1; i--) {
      const r = await typeCode(first.cookie, wrong);
      expect(r.out.status).toBe(400);
      expect((r.out.body as { error: string }).error).toContain(`${i} attempt`);
    }
    const last = await typeCode(first.cookie, wrong);
    expect(last.out.status).toBe(429);
    const right = await typeCode(first.cookie, first.code!);
    expect(right.out.status).toBe(429);
    expect(await signedInAs(right.cookie)).toBeNull();
  });

  it("wrong codes sent with someone else's address (forged _totp cookie) do not lock that person's code", async () => {
    const victim = await requestCode("known@lab.test");
    // The attacker never asked for a code; they write the victim's address into the unsigned cookie.
    const forged = "_totp=email=known%40lab.test";
    const wrong = victim.code === "AAAAAA" ? "BBBBBB" : "AAAAAA";
    for (let i = 0; i < policy.maxWrongAttempts + 2; i++) {
      const r = await typeCode(forged, wrong);
      expect(r.out.status).toBe(400);
      expect(await signedInAs(r.cookie)).toBeNull();
    }
    const row = await t.db.selectFrom("login_codes").select("attempts").where("email", "=", "known@lab.test").orderBy("created_at", "desc").executeTakeFirstOrThrow();
    expect(row.attempts).toBe(0);
    const done = await typeCode(victim.cookie, victim.code!);
    expect(done.out.status).toBe(302);
    expect(await signedInAs(done.cookie)).toBe("known@lab.test");
  });

  it("a ticket for one's own code cannot spend attempts on another address's code", async () => {
    const victim = await requestCode("known@lab.test");
    const attacker = await requestCode("attacker@lab.test", { client: "192.0.2.9" });
    const swapped = attacker.cookie.replace("email=attacker%40lab.test", "email=known%40lab.test");
    expect(swapped).not.toBe(attacker.cookie);
    for (let i = 0; i < policy.maxWrongAttempts; i++) await typeCode(swapped, "AAAAAA");
    const done = await typeCode(victim.cookie, victim.code!);
    expect(done.out.status).toBe(302);
  });

  it(`expires a code after ${10} minutes`, async () => {
    const first = await requestCode("known@lab.test");
    vi.useFakeTimers({ toFake: ["Date"] });
    vi.setSystemTime(Date.now() + (policy.codeMinutes * 60 + 5) * 1000);
    const late = await typeCode(first.cookie, first.code!);
    expect(late.out.status).toBe(400);
    expect((late.out.body as { error: string }).error).toMatch(/expired/);
    expect(await signedInAs(late.cookie)).toBeNull();
  });

  it("a new code replaces the previous one", async () => {
    const first = await requestCode("known@lab.test");
    const second = await requestCode("known@lab.test", { cookie: first.cookie });
    const old = await typeCode(second.cookie, first.code!);
    expect(old.out.status).toBe(400);
    const fresh = await typeCode(old.cookie, second.code!);
    expect(fresh.out.status).toBe(302);
  });

  it("signs in with the magic link once, in the same browser only", async () => {
    const first = await requestCode("known@lab.test");
    const path = new URL(first.link!).pathname + new URL(first.link!).search;
    const elsewhere = await run(magic.loader, makeRequest(path));
    expect(elsewhere.status).toBe(302);
    expect(await signedInAs(cookiesFrom(elsewhere.response!))).toBeNull();

    const ok = await run(magic.loader, makeRequest(path, { cookie: first.cookie }));
    expect(ok.status).toBe(302);
    expect(ok.location).toBe("/labs");
    expect(await signedInAs(cookiesFrom(ok.response!, first.cookie))).toBe("known@lab.test");

    const reuse = await run(magic.loader, makeRequest(path, { cookie: first.cookie }));
    expect(reuse.location).toBe("/sign-in?link=expired");
  });

  it("rate-limits code requests per address, with the same answer for unknown addresses", async () => {
    for (const email of ["known@lab.test", "ghost@lab.test"]) {
      for (let i = 0; i < policy.maxRequestsPerAddress; i++) {
        expect((await requestCode(email, { client: `10.0.0.${i}` })).out.status).toBe(302);
      }
      const blocked = await requestCode(email, { client: "10.0.0.99" });
      expect(blocked.out.status).toBe(429);
      expect((blocked.out.body as { error: string }).error).toMatch(/Too many sign-in codes/);
    }
    expect(outbox).toHaveLength(2 * policy.maxRequestsPerAddress);
  });

  it("rate-limits code requests per client (the address in the server's load context)", async () => {
    for (let i = 0; i < policy.maxRequestsPerClient; i++) {
      expect((await requestCode(`person${i}@lab.test`, { client: "198.51.100.7" })).out.status).toBe(302);
    }
    expect((await requestCode("one-more@lab.test", { client: "198.51.100.7" })).out.status).toBe(429);
    // A header the client wrote does not help: the app never reads X-Forwarded-For itself.
    expect((await requestCode("one-more@lab.test", { client: "198.51.100.7", forwardedFor: "203.0.113.1" })).out.status).toBe(429);
    expect((await requestCode("one-more@lab.test", { client: "192.0.2.44" })).out.status).toBe(302);
  });

  it("holds the per-client limit under 100 parallel requests (one client, many addresses)", async () => {
    const results = await Promise.all(
      Array.from({ length: 100 }, (_, i) => requestCode(`parallel${i}@lab.test`, { client: "198.51.100.50" })),
    );
    expect(results.filter((r) => r.out.status === 302)).toHaveLength(policy.maxRequestsPerClient);
    expect(results.filter((r) => r.out.status === 429)).toHaveLength(100 - policy.maxRequestsPerClient);
    expect(outbox).toHaveLength(policy.maxRequestsPerClient);
  });

  it("holds the per-address limit under 40 parallel requests for one address", async () => {
    const results = await Promise.all(Array.from({ length: 40 }, (_, i) => requestCode("known@lab.test", { client: `10.9.0.${i}` })));
    expect(results.filter((r) => r.out.status === 302)).toHaveLength(policy.maxRequestsPerAddress);
    expect(outbox).toHaveLength(policy.maxRequestsPerAddress);
  });

  it("refuses malformed addresses without sending mail", async () => {
    const r = await requestCode("not-an-address");
    expect(r.out.status).toBe(400);
    expect(outbox).toHaveLength(0);
  });
});
