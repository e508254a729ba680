import type { DbExecutor } from "~/db/schema";
import { randomToken, sha256Hex } from "~/auth/hashing.server";
import { recordAudit } from "~/shared/audit.server";
import { isUuid } from "~/shared/uuid";

/** Recognisable prefix so leaked tokens are easy to spot in logs and secret scanners. */
export const TOKEN_PREFIX = "stp_";

export interface ApiTokenSummary {
  id: string;
  name: string;
  createdAt: Date;
  expiresAt: Date | null;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
}

/**
 * Creates a personal token. The returned `token` is the only copy ever: the table keeps its
 * SHA-256, so a database leak does not hand out working tokens.
 */
export async function createApiToken(
  db: DbExecutor,
  args: { userId: string; name: string; expiresAt: Date | null },
): Promise<{ token: string; id: string }> {
  const token = TOKEN_PREFIX + randomToken(32);
  const row = await db
    .insertInto("api_tokens")
    .values({ user_id: args.userId, name: args.name, token_hash: sha256Hex(token), expires_at: args.expiresAt })
    .returning("id")
    .executeTakeFirstOrThrow();
  await recordAudit(db, { kind: "api_token.created", actorId: args.userId, details: { tokenId: row.id, name: args.name } });
  return { token, id: row.id };
}

export async function listApiTokens(db: DbExecutor, userId: string): Promise<ApiTokenSummary[]> {
  const rows = await db
    .selectFrom("api_tokens")
    .select(["id", "name", "created_at", "expires_at", "last_used_at", "revoked_at"])
    .where("user_id", "=", userId)
    .orderBy("created_at", "desc")
    .execute();
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    createdAt: r.created_at,
    expiresAt: r.expires_at,
    lastUsedAt: r.last_used_at,
    revokedAt: r.revoked_at,
  }));
}

/** Revokes one of the user's own tokens; false when there is no such live token of theirs. */
export async function revokeApiToken(db: DbExecutor, userId: string, tokenId: string): Promise<boolean> {
  if (!isUuid(tokenId)) return false;
  const row = await db
    .updateTable("api_tokens")
    .set({ revoked_at: new Date() })
    .where("id", "=", tokenId)
    .where("user_id", "=", userId)
    .where("revoked_at", "is", null)
    .returning(["id", "name"])
    .executeTakeFirst();
  if (!row) return false;
  await recordAudit(db, { kind: "api_token.revoked", actorId: userId, details: { tokenId: row.id, name: row.name } });
  return true;
}

/** The owner of a live (not revoked, not expired) token, recording when it was used. */
export async function findUserIdByApiToken(db: DbExecutor, token: string): Promise<string | undefined> {
  if (!token.startsWith(TOKEN_PREFIX) || token.length > 200) return undefined;
  const now = new Date();
  const row = await db
    .updateTable("api_tokens")
    .set({ last_used_at: now })
    .where("token_hash", "=", sha256Hex(token))
    .where("revoked_at", "is", null)
    .where((eb) => eb.or([eb("expires_at", "is", null), eb("expires_at", ">", now)]))
    .returning("user_id")
    .executeTakeFirst();
  return row?.user_id;
}

export function parseTokenName(raw: unknown): { ok: true; value: string } | { ok: false; message: string } {
  const value = typeof raw === "string" ? raw.trim() : "";
  if (!value) return { ok: false, message: "Give the token a name, e.g. the script that will use it." };
  if (value.length > 100) return { ok: false, message: "Please keep the name under 100 characters." };
  return { ok: true, value };
}

/** Optional expiry as a number of days from now (1–365); empty means never. */
export function parseExpiryDays(raw: unknown, now = new Date()): { ok: true; value: Date | null } | { ok: false; message: string } {
  const text = typeof raw === "string" ? raw.trim() : "";
  if (text === "" || text === "never") return { ok: true, value: null };
  const days = Number(text);
  if (!Number.isInteger(days) || days < 1 || days > 365) {
    return { ok: false, message: "Expiry must be a whole number of days between 1 and 365, or never." };
  }
  return { ok: true, value: new Date(now.getTime() + days * 86_400_000) };
}
