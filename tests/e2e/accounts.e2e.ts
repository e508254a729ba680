import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { type E2EBrowser, hasApp, openBrowser } from "./support/browser";
import { signInWithCode, waitForMail } from "./accounts-helpers";

/**
 * A lab lead signs in with an e-mailed code, creates a lab and invites a colleague as viewer; the
 * colleague accepts through the e-mailed link (signing in with the invited address) and then
 * cannot edit: no edit controls, and a hand-made POST is refused with 403 and changes nothing.
 */
describe.skipIf(!hasApp)("accounts: sign-in, labs and invitations in headless chromium", () => {
  let lead: E2EBrowser;
  let guest: E2EBrowser;
  const run = Date.now().toString(36);
  const leadEmail = `lead-${run}@e2e.test`;
  const guestEmail = `guest-${run}@e2e.test`;
  const labName = `Relaxation Kinetics ${run}`;
  let labPath = "";
  let acceptUrl = "";

  beforeAll(async () => {
    lead = await openBrowser();
    guest = await openBrowser();
  });
  afterAll(async () => {
    await lead?.close();
    await guest?.close();
  });

  it("signs in with the code read from maildev and creates the account", async () => {
    const { page } = await lead.page("/sign-in");
    await signInWithCode(page, leadEmail, "Lena Lead");
    expect(new URL(page.url()).pathname).toBe("/labs");
    await page.getByTestId("session-state").getByText("Lena Lead").waitFor();
    const cookies = await lead.context.cookies();
    const session = cookies.find((c) => c.name === "stillpoint_session");
    expect(session?.httpOnly).toBe(true);
    expect(session?.sameSite).toBe("Lax");
  });

  it("creates a lab and invites a second address as viewer", async () => {
    const { page } = await lead.page("/labs");
    await page.getByLabel("Name").fill(labName);
    await page.getByRole("button", { name: "Create lab" }).click();
    // The lab's own heading, not the URL: client navigation changes the URL before it renders.
    await page.getByTestId("lab-name").waitFor();
    labPath = new URL(page.url()).pathname;
    expect(labPath).toMatch(/^\/labs\/relaxation-kinetics-/);
    expect(await page.getByTestId("lab-name").innerText()).toBe(labName);

    await page.goto(`${labPath}/members`, { waitUntil: "networkidle" });
    const sent = new Date();
    await page.getByLabel("Invite by e-mail").fill(guestEmail);
    await page.getByLabel("Role", { exact: true }).selectOption("viewer");
    await page.getByRole("button", { name: "Send invitation" }).click();
    await page.getByText(`Invitation sent to ${guestEmail}.`).waitFor();
    expect(await page.getByTestId("invitations").innerText()).toContain(guestEmail);

    const mail = await waitForMail(guestEmail, sent, /invited you/);
    acceptUrl = /(http\S+\/invitations\/[A-Za-z0-9_-]+)/.exec(mail.text)![1]!;
  });

  it("the invited person accepts after signing in with the invited address", async () => {
    const { page } = await guest.page(new URL(acceptUrl).pathname);
    expect(await page.locator("h1").innerText()).toBe(`Join ${labName}`);
    await page.getByRole("link", { name: `Sign in as ${guestEmail} to accept` }).click();
    await page.getByLabel("E-mail address").waitFor();
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    expect(await page.getByLabel("E-mail address").inputValue()).toBe(guestEmail);
    await signInWithCode(page, guestEmail, "Gil Guest");
    expect(new URL(page.url()).pathname).toBe(new URL(acceptUrl).pathname);
    await page.getByRole("button", { name: "Accept invitation" }).click();
    await page.getByTestId("lab-name").waitFor();
    expect(new URL(page.url()).pathname).toBe(labPath);
    await expect.poll(() => page.getByText("You are").innerText()).toContain("viewer");
    expect(await page.getByTestId("active-lab").innerText()).toBe(labName);
  });

  it("the viewer cannot edit: no controls, and a forged POST is refused without effect", async () => {
    const { page } = await guest.page(labPath);
    expect(await page.getByRole("button", { name: "Rename" }).count()).toBe(0);
    await page.goto(`${labPath}/members`, { waitUntil: "networkidle" });
    expect(await page.getByRole("button", { name: "Send invitation" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: "Remove" }).count()).toBe(0);

    const rename = await page.request.post(labPath, { form: { intent: "rename", name: "Taken over" } });
    expect(rename.status()).toBe(403);
    const invite = await page.request.post(`${labPath}/members`, { form: { intent: "invite", email: "x@e2e.test", role: "owner" } });
    expect(invite.status()).toBe(403);
    // Networks are what editors edit: the upload page and its action refuse a viewer too.
    expect((await page.request.get(`${labPath}/networks/new`)).status()).toBe(403);
    expect((await page.request.post(`${labPath}/networks/new`, { form: { name: "Forged" } })).status()).toBe(403);
    const audit = await page.request.get(`/api${labPath}/audit`);
    expect(audit.status()).toBe(403);
    expect(await audit.json()).toMatchObject({ error: { code: "forbidden" } });

    const { page: leadPage } = await lead.page(labPath);
    expect(await leadPage.getByTestId("lab-name").innerText()).toBe(labName);
    await leadPage.goto(`${labPath}/members`, { waitUntil: "networkidle" });
    const table = await leadPage.getByTestId("members").innerText();
    expect(table).toContain("Gil Guest");
    expect(await leadPage.getByTestId("invitations").count()).toBe(0);
  });

  it("the owner sees the story in the audit log", async () => {
    const { page } = await lead.page(`${labPath}/audit`);
    const log = await page.getByTestId("audit").innerText();
    for (const kind of ["lab.created", "invitation.sent", "invitation.accepted"]) expect(log).toContain(kind);
  });
});
