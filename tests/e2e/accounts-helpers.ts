/**
 * Signing in from browser tests the way a person does: type the address, read the code from the
 * local mail catcher's REST API (maildev `GET /api/email`), type the code. Other e2e files may
 * use `signInWithCode` too. `resetSignInLimits` clears the sign-in rate-limit ledger for an
 * address (and spent codes) through E2E_DATABASE_URL, so many test files can sign in as the same
 * demo person without tripping the per-address and per-client limits.
 */
import type { Page } from "playwright-core";
import pg from "pg";
import { type E2EBrowser, maildevUrl, openBrowser } from "./support/browser";

interface CaughtMail {
  id: string;
  subject: string;
  text: string;
  time: string;
  to: { address: string }[];
}

/** The newest message to `address` that arrived after `after` (polls for up to 15 s). */
export async function waitForMail(address: string, after: Date, match: RegExp = /./): Promise<CaughtMail> {
  const deadline = Date.now() + 15_000;
  while (Date.now() < deadline) {
    const res = await fetch(`${maildevUrl}/api/email`);
    const all = (await res.json()) as CaughtMail[];
    const mine = all
      .filter((m) => m.to.some((t) => t.address.toLowerCase() === address.toLowerCase()))
      .filter((m) => new Date(m.time).getTime() >= after.getTime() - 1000 && match.test(m.subject))
      .sort((a, b) => new Date(b.time).getTime() - new Date(a.time).getTime());
    if (mine[0]) return mine[0];
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`no mail to ${address} matching ${match} arrived in maildev`);
}

export async function resetSignInLimits(address: string): Promise<void> {
  const url = process.env.E2E_DATABASE_URL;
  if (!url) return;
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    // This address's codes, and used codes of anyone (they only count towards the shared client limit).
    await client.query("DELETE FROM login_codes WHERE email = $1 OR consumed_at IS NOT NULL", [address.toLowerCase()]);
    // The request ledger too: every browser test signs in from 127.0.0.1, and a whole run signs in
    // more often than one client may within the window (the limiter has tests of its own).
    await client.query("DELETE FROM rate_limit_events WHERE bucket LIKE 'code:%'");
  } finally {
    await client.end();
  }
}

/**
 * Signs `page`'s browser context in as `email`. Starts at /sign-in unless the page is already
 * on the sign-in form (e.g. after following "Sign in to accept"). A first-time address gets the
 * display-name step, answered with `displayName`.
 */
export async function signInWithCode(page: Page, email: string, displayName = "E2E Person"): Promise<void> {
  await resetSignInLimits(email);
  if (!new URL(page.url(), "http://x").pathname.startsWith("/sign-in")) {
    await page.goto("/sign-in", { waitUntil: "networkidle" });
  }
  const asked = new Date();
  await page.getByLabel("E-mail address").fill(email);
  await page.getByRole("button", { name: "Send me a code" }).click();
  // Client navigation changes the URL before the next page renders: wait for its field instead.
  await page.getByLabel("Code").waitFor();
  const mail = await waitForMail(email, asked, /sign-in code/);
  const code = /sign-in code is ([A-Z0-9]{6})/.exec(mail.text)?.[1];
  if (!code) throw new Error(`no code in the mail: ${mail.text}`);
  await page.getByLabel("Code").fill(code);
  await page.getByRole("button", { name: "Sign in" }).click();
  // Either the first-visit step or the signed-in shell, whichever renders.
  const displayNameField = page.getByLabel("Display name");
  const userMenu = page.getByTestId("user-menu");
  await displayNameField.or(userMenu).first().waitFor();
  if (await displayNameField.isVisible()) {
    await displayNameField.fill(displayName);
    await page.getByRole("button", { name: "Create my account" }).click();
    await userMenu.waitFor();
  }
}

/** A fresh browser already signed in as `email` (the beforeAll of most browser test files). */
export async function openSignedInBrowser(email: string, displayName?: string): Promise<E2EBrowser> {
  const browser = await openBrowser();
  const { page } = await browser.page("/sign-in");
  await signInWithCode(page, email, displayName);
  await page.close();
  return browser;
}
