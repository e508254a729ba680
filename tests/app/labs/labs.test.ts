import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parseLabName, slugify } from "~/labs/labs.server";
import { invitationMail, signInCodeMail } from "~/mail/templates";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { makeUser, setUpAccountsDb, tearDownAccountsDb } from "../auth/fixtures";

describe("lab names and slugs", () => {
  it("makes URL-safe slugs that the labs table accepts", () => {
    expect(slugify("Kinetics Group (Zürich)")).toBe("kinetics-group-zurich");
    expect(slugify("  --  ")).toBe("lab");
    expect(slugify("x".repeat(80))).toHaveLength(48);
    for (const s of ["A  B", "é!", "Ab-12 cd"]) expect(slugify(s)).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*$/);
  });

  it("validates names", () => {
    expect(parseLabName("  Enzyme   Lab ")).toEqual({ ok: true, value: "Enzyme Lab" });
    expect(parseLabName(" ").ok).toBe(false);
  });
});

describe("mail templates", () => {
  it("put the code, the link and the expiry in the sign-in mail, escaping HTML", () => {
    const m = signInCodeMail({ to: "a@b.org", code: "ABC234", magicLink: "http://h/sign-in/magic?t=x&y", minutes: 10 });
    expect(m.subject).toContain("ABC234");
    expect(m.text).toContain("http://h/sign-in/magic?t=x&y");
    expect(m.text).toContain("10 minutes");
    expect(m.html).toContain("t=x&amp;y");
  });

  it("name the lab, the role and the address in the invitation", () => {
    const m = invitationMail({ to: "v@b.org", labName: "<Lab>", role: "viewer", inviterName: "Olga", acceptUrl: "http://h/invitations/T", expiresAt: new Date("2030-01-08T00:00:00Z") });
    expect(m.text).toContain('"<Lab>" as viewer');
    expect(m.text).toContain("http://h/invitations/T");
    expect(m.text).toContain("2030-01-08");
    expect(m.html).toContain("&lt;Lab&gt;");
  });
});

describe.skipIf(!hasTestDatabase)("createLab", () => {
  let t: TestDatabase;
  beforeAll(async () => {
    t = await setUpAccountsDb();
  });
  afterAll(async () => tearDownAccountsDb(t));

  it("makes the creator owner, numbers clashing slugs and audits", async () => {
    const { createLab, listLabsOf } = await import("~/labs/labs.server");
    const { db } = await import("~/db.server");
    const ada = await makeUser(t.db, "ada@lab.test", "Ada");
    const a = await createLab(db(), { userId: ada.id, name: "Enzyme Lab" });
    const b = await createLab(db(), { userId: ada.id, name: "Enzyme lab!" });
    expect([a.slug, b.slug]).toEqual(["enzyme-lab", "enzyme-lab-2"]);
    expect((await listLabsOf(db(), ada.id)).map((l) => [l.slug, l.role, l.memberCount])).toEqual([
      ["enzyme-lab", "owner", 1],
      ["enzyme-lab-2", "owner", 1],
    ]);
    expect(await t.db.selectFrom("audit_events").select("kind").where("kind", "=", "lab.created").execute()).toHaveLength(2);
  });
});
