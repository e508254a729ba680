import { createCookie, createSessionStorage, type Session } from "react-router";
import { getEnv } from "~/env.server";
import type { JsonObject } from "~/db/schema";
import { db } from "~/db.server";
import { LruMap } from "~/components/render-cache";
import { randomToken, sha256Hex } from "./hashing.server";

/** What a session may hold. `pendingEmail` is a verified address that has no account yet. */
export interface SessionData {
  userId?: string;
  pendingEmail?: string;
  /** Slug of the lab the user last switched to. */
  labSlug?: string;
  /** Where to go after signing in (a local path). */
  returnTo?: string;
}
export interface SessionFlash {
  notice: string;
}
export type AppSession = Session<SessionData, SessionFlash>;

const THIRTY_DAYS = 60 * 60 * 24 * 30;

let storage: ReturnType<typeof createStorage> | undefined;
let sessionCookie: ReturnType<typeof createCookie> | undefined;

/**
 * Sessions live in the database (table `sessions`); the cookie carries only a random id, signed
 * with SESSION_SECRET. Deleting the row ends the session everywhere, whatever the browser keeps.
 * The row is keyed by the SHA-256 of the id, so a copy of the table cannot be replayed as cookies.
 */
function createStorage() {
  const env = getEnv();
  const cookie = createCookie("stillpoint_session", {
    httpOnly: true,
    sameSite: "lax",
    secure: env.secureCookies,
    path: "/",
    maxAge: THIRTY_DAYS,
    secrets: [env.sessionSecret],
  });
  sessionCookie = cookie;
  const expiry = (expires?: Date) => expires ?? new Date(Date.now() + THIRTY_DAYS * 1000);
  const userIdOf = (data: object) => {
    const v = (data as SessionData).userId;
    return typeof v === "string" ? v : null;
  };
  return createSessionStorage<SessionData, SessionFlash>({
    cookie,
    async createData(data, expires) {
      const id = randomToken();
      await db()
        .insertInto("sessions")
        .values({ id_hash: sha256Hex(id), user_id: userIdOf(data), data: data as JsonObject, expires_at: expiry(expires) })
        .execute();
      return id;
    },
    async readData(id) {
      const row = await db()
        .selectFrom("sessions")
        .select("data")
        .where("id_hash", "=", sessionKey(id))
        .where("expires_at", ">", new Date())
        .executeTakeFirst();
      return (row?.data as never) ?? null;
    },
    // Only a live row is updated. A row that is gone was ended (sign-out, sign-out everywhere,
    // expiry) and stays ended: a request that read the session before it was deleted must not
    // re-insert it. Such a cookie starts over as an anonymous session (identity stripped), so a
    // visitor mid-sign-in keeps `returnTo` but never a `userId` or `pendingEmail`.
    async updateData(id, data, expires) {
      const idHash = sha256Hex(id);
      const values = { user_id: userIdOf(data), data: data as JsonObject, expires_at: expiry(expires) };
      const updated = await db()
        .updateTable("sessions")
        .set(values)
        .where("id_hash", "=", idHash)
        .where("expires_at", ">", new Date())
        .executeTakeFirst();
      if (Number(updated.numUpdatedRows) > 0) return;
      const { userId: _u, pendingEmail: _p, ...anonymous } = data as SessionData;
      await db()
        .insertInto("sessions")
        .values({ id_hash: idHash, user_id: null, data: anonymous as JsonObject, expires_at: expiry(expires) })
        .onConflict((oc) => oc.column("id_hash").doUpdateSet({ user_id: null, data: anonymous as JsonObject, expires_at: expiry(expires) }))
        .execute();
    },
    async deleteData(id) {
      if (!id) return;
      await db().deleteFrom("sessions").where("id_hash", "=", sha256Hex(id)).execute();
    },
  });
}

function sessionStorage() {
  storage ??= createStorage();
  return storage;
}

/**
 * The session id the request's cookie carries (signature checked), or null; for reading the
 * session row together with what it points to in one query (identity.server.ts).
 */
export async function sessionIdOf(request: Request): Promise<string | null> {
  sessionStorage();
  const header = request.headers.get("Cookie");
  if (!header) return null;
  const known = verifiedCookies.get(header);
  if (known !== undefined) return known;
  const id: unknown = await sessionCookie!.parse(header);
  if (typeof id !== "string" || id === "") return null;
  verifiedCookies.set(header, id);
  return id;
}

/**
 * Cookie headers whose signature was checked, and the session id they carry. Checking the HMAC
 * (WebCrypto, asynchronous) was a twentieth of an API request's CPU time; a browser sends the same
 * header on every request, and the same header always verifies the same way under the same
 * secret. Only headers that verified are kept (a forger cannot fill the map), and whether the
 * session is still live is asked of the database every time: this remembers the signature, not
 * the session.
 */
const verifiedCookies = new LruMap<string>(5000);

/** The row key of a session id (the table stores only its hash). */
export const sessionKey = (id: string) => sha256Hex(id);

export function getSession(request: Request): Promise<AppSession> {
  return sessionStorage().getSession(request.headers.get("Cookie"));
}

export function commitSession(session: AppSession): Promise<string> {
  return sessionStorage().commitSession(session);
}

export function destroySession(session: AppSession): Promise<string> {
  return sessionStorage().destroySession(session);
}

/**
 * A brand-new session for a user who just proved their address, replacing (and deleting) the
 * old one so that an id planted before sign-in never becomes an authenticated session.
 */
export async function rotateSession(old: AppSession, data: SessionData): Promise<string> {
  if (old.id) await db().deleteFrom("sessions").where("id_hash", "=", sha256Hex(old.id)).execute();
  await sweepExpiredSessions();
  const fresh = await sessionStorage().getSession();
  for (const [key, value] of Object.entries(data)) {
    if (value !== undefined) fresh.set(key as keyof SessionData, value);
  }
  return commitSession(fresh);
}

/** Ends every session of a user (all browsers, including the current one). */
export async function destroyAllSessionsOf(userId: string): Promise<number> {
  const result = await db().deleteFrom("sessions").where("user_id", "=", userId).executeTakeFirst();
  return Number(result.numDeletedRows);
}

/** Housekeeping: drop expired rows (run at every sign-in; the expiry index keeps it cheap). */
export async function sweepExpiredSessions(): Promise<void> {
  await db().deleteFrom("sessions").where("expires_at", "<=", new Date()).execute();
}

const RETURN_BASE = "http://stillpoint.invalid";

/**
 * A same-origin path only, normalised, so `returnTo` can neither send anyone to another site nor
 * break the redirect header. Browsers drop tabs and newlines from URLs (WHATWG URL parsing), so
 * `/\t/evil.example` would become `//evil.example`, another host: any control character,
 * whitespace (ASCII or not, e.g. U+3000) or backslash refuses the value outright. What remains is
 * resolved against a placeholder origin and must stay on it; the answer is the resolved path
 * (percent-encoded ASCII, safe in a Location header) with no leading `//`.
 *
 *   safeReturnTo("/labs/x?y=1")              // "/labs/x?y=1"
 *   safeReturnTo("/\t/evil.example/phish")  // "/labs"
 *   safeReturnTo("/a/../b")                  // "/b"
 */
export function safeReturnTo(value: unknown, fallback = "/labs"): string {
  if (typeof value !== "string" || value.length > 2048 || !value.startsWith("/") || value.startsWith("//")) return fallback;
  if (/[\u0000-\u0020\u007f-\u00a0\\\s\u2028\u2029\ufeff]/u.test(value)) return fallback;
  let url: URL;
  try {
    url = new URL(value, RETURN_BASE);
  } catch {
    return fallback;
  }
  if (url.origin !== RETURN_BASE) return fallback;
  const path = url.pathname + url.search + url.hash;
  if (!path.startsWith("/") || path.startsWith("//")) return fallback;
  return path;
}
