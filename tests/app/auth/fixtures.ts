/**
 * Shared set-up for the accounts tests: a private database copied from the migrated template,
 * wired into the app's shared `db()` through DATABASE_URL, fixed secrets (so nothing is written
 * to .data/), users with sessions, and helpers that call route loaders/actions directly with
 * constructed Requests and report what HTTP status the server would send.
 */
import type { ServerLoadContext } from "~/load-context";
import type { Kysely } from "kysely";
import type { Database, LabRole } from "~/db/schema";
import { createTestDatabase, type TestDatabase } from "../support/test-db";

export const APP_URL = "http://127.0.0.1:3999";

/** Call first in beforeAll, before anything reads the environment. */
export async function setUpAccountsDb(): Promise<TestDatabase> {
  const t = await createTestDatabase();
  process.env.DATABASE_URL = t.url;
  process.env.SESSION_SECRET = "test-session-secret-0123456789abcdef0123456789";
  process.env.TOTP_SECRET = "ab".repeat(32);
  process.env.APP_URL = APP_URL;
  return t;
}

export async function tearDownAccountsDb(t: TestDatabase | undefined): Promise<void> {
  const { closeDb } = await import("~/db.server");
  await closeDb();
  await t?.drop();
}

export async function makeUser(db: Kysely<Database>, email: string, name: string, opts: { admin?: boolean } = {}) {
  return db
    .insertInto("users")
    .values({ email, display_name: name, is_site_admin: opts.admin ?? false })
    .returning(["id", "email"])
    .executeTakeFirstOrThrow();
}

export async function makeLab(db: Kysely<Database>, slug: string, name: string, members: [string, LabRole][]) {
  const lab = await db.insertInto("labs").values({ slug, name }).returning(["id", "slug"]).executeTakeFirstOrThrow();
  for (const [userId, role] of members) {
    await db.insertInto("memberships").values({ lab_id: lab.id, user_id: userId, role }).execute();
  }
  return lab;
}

/** A signed session cookie for `userId`, created through the app's own session storage. */
export async function sessionCookieFor(userId: string): Promise<string> {
  const { getSession, commitSession } = await import("~/auth/session.server");
  const session = await getSession(new Request(APP_URL));
  session.set("userId", userId);
  return cookiePair(await commitSession(session));
}

/** "name=value" from a Set-Cookie header (what a browser sends back). */
export function cookiePair(setCookie: string): string {
  return setCookie.split(";")[0]!;
}

/** All Set-Cookie headers of a response as "name=value" pairs, joined for a Cookie header. */
export function cookiesFrom(response: Response, previous = ""): string {
  const jar = new Map<string, string>();
  for (const pair of previous.split(/;\s*/).filter(Boolean)) {
    const i = pair.indexOf("=");
    jar.set(pair.slice(0, i), pair.slice(i + 1));
  }
  for (const header of response.headers.getSetCookie()) {
    const pair = cookiePair(header);
    const i = pair.indexOf("=");
    const expired = /Max-Age=0|Expires=Thu, 01 Jan 1970/i.test(header);
    if (expired || pair.slice(i + 1) === "") jar.delete(pair.slice(0, i));
    else jar.set(pair.slice(0, i), pair.slice(i + 1));
  }
  return [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
}

export interface RequestOptions {
  method?: string;
  cookie?: string;
  bearer?: string;
  form?: Record<string, string>;
  json?: unknown;
  headers?: Record<string, string>;
}

export function makeRequest(path: string, opts: RequestOptions = {}): Request {
  const headers = new Headers(opts.headers);
  if (opts.cookie) headers.set("Cookie", opts.cookie);
  if (opts.bearer) headers.set("Authorization", `Bearer ${opts.bearer}`);
  let body: string | undefined;
  if (opts.form) {
    headers.set("Content-Type", "application/x-www-form-urlencoded");
    body = new URLSearchParams(opts.form).toString();
  } else if (opts.json !== undefined) {
    headers.set("Content-Type", "application/json");
    body = JSON.stringify(opts.json);
  }
  const method = opts.method ?? (body === undefined ? "GET" : "POST");
  return new Request(new URL(path, APP_URL), { method, headers, body });
}

export interface Outcome {
  status: number;
  location: string | null;
  body: unknown;
  response?: Response;
}

type Handler = (args: any) => unknown;

/**
 * Runs a loader or action the way React Router would and reports the HTTP outcome: thrown or
 * returned Responses as they are, `data(value, { status })` with its status, plain values as 200.
 */
export async function run(handler: Handler, request: Request, params: Record<string, string> = {}, context: ServerLoadContext = {}): Promise<Outcome> {
  let value: unknown;
  try {
    value = await handler({ request, params, context });
  } catch (thrown) {
    value = thrown;
    if (!(thrown instanceof Response) && !isData(thrown)) throw thrown;
  }
  if (value instanceof Response) {
    const text = await value.clone().text();
    let body: unknown = text;
    try {
      body = JSON.parse(text);
    } catch {
      /* not JSON */
    }
    return { status: value.status, location: value.headers.get("Location"), body, response: value };
  }
  if (isData(value)) return { status: value.init?.status ?? 200, location: null, body: value.data };
  return { status: 200, location: null, body: value };
}

function isData(v: unknown): v is { type: "DataWithResponseInit"; data: unknown; init: ResponseInit | null } {
  return typeof v === "object" && v !== null && (v as { type?: unknown }).type === "DataWithResponseInit";
}

/**
 * Every row the accounts features can change, in a stable order: compare before/after a refused
 * request to prove it changed nothing.
 */
export async function snapshot(db: Kysely<Database>) {
  const [users, labs, memberships, invitations, tokens, audit] = await Promise.all([
    db.selectFrom("users").selectAll().orderBy("id").execute(),
    db.selectFrom("labs").selectAll().orderBy("id").execute(),
    db.selectFrom("memberships").selectAll().orderBy("lab_id").orderBy("user_id").execute(),
    db.selectFrom("invitations").selectAll().orderBy("id").execute(),
    // last_used_at moves whenever a live token is presented, even on a refused request.
    db.selectFrom("api_tokens").select(["id", "user_id", "name", "token_hash", "created_at", "expires_at", "revoked_at"]).orderBy("id").execute(),
    db.selectFrom("audit_events").selectAll().orderBy("id").execute(),
  ]);
  return JSON.stringify({ users, labs, memberships, invitations, tokens, audit });
}
