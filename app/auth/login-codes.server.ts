import { sql } from "kysely";
import { getEnv } from "~/env.server";
import { db } from "~/db.server";
import { hmacHex } from "./hashing.server";
import { takeRateLimit } from "./rate-limit.server";

/**
 * Server-side ledger of e-mailed sign-in codes. remix-auth-totp keeps its state in a cookie the
 * browser could replay and (in v4) does not count wrong typed codes, so this ledger is what makes
 * a code single-use, expiring and attempt-limited, and what rate-limits code requests.
 */
export const SIGN_IN_POLICY = {
  codeMinutes: 10,
  maxWrongAttempts: 5,
  windowMinutes: 15,
  maxRequestsPerAddress: 5,
  maxRequestsPerClient: 30,
} as const;

/** Codes are typed by hand: upper-case letters and digits without the look-alikes 0/O and 1/I. */
export const CODE_CHARSET = "ABCDEFGHJKLMNPQRSTUVWXYZ23456789";

export function normalizeCode(raw: unknown): string {
  return typeof raw === "string" ? raw.replace(/[\s-]+/g, "").toUpperCase() : "";
}

export function normalizeEmail(raw: unknown): string {
  return typeof raw === "string" ? raw.trim().toLowerCase() : "";
}

export function looksLikeEmail(email: string): boolean {
  return email.length <= 254 && /^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(email);
}

const keyed = (value: string) => hmacHex(getEnv().totpSecret, value);

export type RequestVerdict = { allowed: true } | { allowed: false; retryAfterSeconds: number };

/**
 * May this client request another code for this address now? Takes one slot per address and per
 * client in the sliding window, atomically (rate-limit.server.ts), so parallel requests cannot
 * overrun the limits; the answer does not depend on whether the address has an account.
 */
export async function checkCodeRequest(email: string, client: string): Promise<RequestVerdict> {
  const windowMinutes = SIGN_IN_POLICY.windowMinutes;
  return takeRateLimit([
    { bucket: `code:address:${keyed(email)}`, max: SIGN_IN_POLICY.maxRequestsPerAddress, windowMinutes },
    { bucket: `code:client:${client}`.slice(0, 200), max: SIGN_IN_POLICY.maxRequestsPerClient, windowMinutes },
  ]);
}

/**
 * Records a freshly sent code (and its magic-link token); earlier open codes for the address stop
 * working. Returns the ledger row id, which the requesting browser gets as its ticket
 * (code-ticket.server.ts).
 */
export async function recordIssuedCode(args: { email: string; code: string; linkToken: string; client: string }): Promise<string> {
  const now = new Date();
  return db().transaction().execute(async (trx) => {
    await trx
      .updateTable("login_codes")
      .set({ invalidated_at: now })
      .where("email", "=", args.email)
      .where("consumed_at", "is", null)
      .where("invalidated_at", "is", null)
      .execute();
    const row = await trx
      .insertInto("login_codes")
      .values({
        email: args.email,
        code_hash: keyed(normalizeCode(args.code)),
        link_hash: keyed(args.linkToken),
        client_key: args.client,
        expires_at: new Date(now.getTime() + SIGN_IN_POLICY.codeMinutes * 60_000),
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    // Old rows are only needed for the rate-limit window.
    await trx.deleteFrom("login_codes").where("created_at", "<", new Date(now.getTime() - 86_400_000)).execute();
    return row.id;
  });
}

export type CodeCheck = "ok" | "wrong" | "locked" | "expired";

/**
 * Checks a typed code against the issued code the browser's ticket names (`codeId`, the ledger
 * row), counting a wrong guess on that row. After `maxWrongAttempts` wrong guesses the code is
 * dead ("locked") even if the next guess is right. The counter belongs to the issued code, so
 * nobody can burn another person's attempts by naming their address.
 */
export async function checkTypedCode(codeId: string, email: string, code: string): Promise<{ result: CodeCheck; attemptsLeft: number }> {
  const open = await db()
    .selectFrom("login_codes")
    .select(["id", "code_hash", "attempts", "expires_at", "consumed_at", "invalidated_at"])
    .where("id", "=", codeId)
    .where("email", "=", email)
    .executeTakeFirst();
  if (!open || open.consumed_at || open.expires_at <= new Date()) return { result: "expired", attemptsLeft: 0 };
  if (open.attempts >= SIGN_IN_POLICY.maxWrongAttempts) return { result: "locked", attemptsLeft: 0 };
  if (open.invalidated_at) return { result: "expired", attemptsLeft: 0 };
  if (open.code_hash === keyed(normalizeCode(code))) {
    return { result: "ok", attemptsLeft: SIGN_IN_POLICY.maxWrongAttempts - open.attempts };
  }
  const updated = await db()
    .updateTable("login_codes")
    .set({ attempts: sql`attempts + 1` })
    .where("id", "=", open.id)
    .returning("attempts")
    .executeTakeFirstOrThrow();
  const left = SIGN_IN_POLICY.maxWrongAttempts - updated.attempts;
  if (left <= 0) {
    await db().updateTable("login_codes").set({ invalidated_at: new Date() }).where("id", "=", open.id).execute();
    return { result: "locked", attemptsLeft: 0 };
  }
  return { result: "wrong", attemptsLeft: left };
}

/** Is this magic-link token the open, unexpired code of some address? (No attempt counted.) */
export async function isOpenLink(linkToken: string): Promise<boolean> {
  const row = await db()
    .selectFrom("login_codes")
    .select("id")
    .where("link_hash", "=", keyed(linkToken))
    .where("consumed_at", "is", null)
    .where("invalidated_at", "is", null)
    .where("expires_at", ">", new Date())
    .where("attempts", "<", SIGN_IN_POLICY.maxWrongAttempts)
    .executeTakeFirst();
  return row !== undefined;
}

/**
 * Marks the code used, atomically: of two requests racing with the same code or link, exactly
 * one gets `true`.
 */
export async function consumeCode(email: string, proof: { code: string } | { linkToken: string }): Promise<boolean> {
  let query = db()
    .updateTable("login_codes")
    .set({ consumed_at: new Date() })
    .where("email", "=", email)
    .where("consumed_at", "is", null)
    .where("invalidated_at", "is", null)
    .where("expires_at", ">", new Date())
    .where("attempts", "<", SIGN_IN_POLICY.maxWrongAttempts);
  query =
    "code" in proof
      ? query.where("code_hash", "=", keyed(normalizeCode(proof.code)))
      : query.where("link_hash", "=", keyed(proof.linkToken));
  const row = await query.returning("id").executeTakeFirst();
  return row !== undefined;
}
