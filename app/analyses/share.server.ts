/**
 * Read-only share links for one analysis: a random token shown once to the owner who made it,
 * stored only as its SHA-256, with an expiry, revocable. Anyone holding a live token may read
 * that analysis (and its finished follow-ups), nothing else.
 */
import { sql } from "kysely";
import { randomToken, sha256Hex } from "~/auth/hashing.server";
import { findJobById, type JobRecord } from "./repository.server";
import type { DbExecutor } from "~/db/schema";

export const SHARE_DAYS = { default: 14, max: 90 };

export async function createShareLink(db: DbExecutor, analysisId: string, createdBy: string, days: number): Promise<{ id: string; token: string; expiresAt: Date }> {
  const token = randomToken(32);
  const row = await db
    .insertInto("analysis_share_links")
    .values({ analysis_id: analysisId, token_hash: sha256Hex(token), created_by: createdBy, expires_at: sql`now() + make_interval(days => ${days})` as never })
    .returning(["id", "expires_at"])
    .executeTakeFirstOrThrow();
  return { id: row.id, token, expiresAt: row.expires_at };
}

export async function listShareLinks(db: DbExecutor, analysisId: string) {
  const rows = await db
    .selectFrom("analysis_share_links as l")
    .leftJoin("users as u", "u.id", "l.created_by")
    .select(["l.id", "l.created_at", "l.expires_at", "l.revoked_at", "u.display_name as creator"])
    .where("l.analysis_id", "=", analysisId)
    .orderBy("l.created_at", "desc")
    .execute();
  const now = Date.now();
  return rows.map((r) => ({
    id: r.id,
    createdAt: r.created_at.toISOString(),
    expiresAt: r.expires_at.toISOString(),
    creator: r.creator,
    state: r.revoked_at ? ("revoked" as const) : r.expires_at.getTime() <= now ? ("expired" as const) : ("active" as const),
  }));
}

export async function revokeShareLink(db: DbExecutor, analysisId: string, linkId: string): Promise<boolean> {
  const r = await db
    .updateTable("analysis_share_links")
    .set({ revoked_at: sql`now()` })
    .where("id", "=", linkId)
    .where("analysis_id", "=", analysisId)
    .where("revoked_at", "is", null)
    .executeTakeFirst();
  return Number(r.numUpdatedRows) > 0;
}

/** The analysis a live token opens, or undefined (unknown, expired or revoked: all look the same). */
export async function findSharedAnalysis(db: DbExecutor, token: string | undefined): Promise<JobRecord | undefined> {
  if (!token || !/^[A-Za-z0-9_-]{20,100}$/.test(token)) return undefined;
  const link = await db
    .selectFrom("analysis_share_links")
    .select("analysis_id")
    .where("token_hash", "=", sha256Hex(token))
    .where("revoked_at", "is", null)
    .where("expires_at", ">", sql<Date>`now()`)
    .executeTakeFirst();
  return link ? findJobById(db, link.analysis_id) : undefined;
}
