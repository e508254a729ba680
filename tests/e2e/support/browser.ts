/**
 * Headless Debian chromium through playwright-core (never a downloaded browser), pointed at
 * the app `npm test` started. Use: `const b = await openBrowser(); const page = await b.page("/")`.
 */
import { type Browser, type BrowserContext, type Page, chromium } from "playwright-core";

export const baseUrl = process.env.E2E_BASE_URL ?? "";
export const maildevUrl = process.env.E2E_MAILDEV_URL ?? "";
export const hasApp = baseUrl !== "";

const CHROMIUM_ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];

export interface E2EBrowser {
  browser: Browser;
  context: BrowserContext;
  /** A new page at `pathname`, with every request URL recorded. */
  page(pathname?: string): Promise<{ page: Page; requests: string[]; status: number | undefined }>;
  close(): Promise<void>;
}

export async function openBrowser(): Promise<E2EBrowser> {
  if (!hasApp) throw new Error("E2E_BASE_URL is not set; run the browser tests through `npm test`");
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: CHROMIUM_ARGS,
  });
  const context = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1280, height: 900 } });
  return {
    browser,
    context,
    async page(pathname = "/") {
      const page = await context.newPage();
      const requests: string[] = [];
      page.on("request", (r) => requests.push(r.url()));
      const response = await page.goto(pathname, { waitUntil: "networkidle" });
      return { page, requests, status: response?.status() };
    },
    async close() {
      await context.close();
      await browser.close();
    },
  };
}
