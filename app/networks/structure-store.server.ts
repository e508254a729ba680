/**
 * Structures off the request path. The web server never computes a structure: saving a version
 * (or viewing one whose structure is not stored yet) records a request row keyed by the file's
 * content hash, and the worker (app/jobs/worker.server.ts) computes the open rows one by one with
 * the domain's analyseStructure, exactly as the CLI's `analyse --json` does. Pages show "being
 * computed" and poll until the row is ready; the JSON API answers `structure: null` with
 * `structureStatus: "pending"` meanwhile. Ready structures are also kept in memory by hash: a
 * version never changes, so neither does its structure.
 */
import { sql, type Kysely } from "kysely";
import type { NetworkStructure } from "@domain/network/index";
import { LruMap } from "~/components/render-cache";
import type { Database, DbExecutor, JsonObject } from "~/db/schema";
import { contentHash } from "./networks.server";
import { analyseCsv } from "./structure.server";

export type StructureState =
  | { status: "ready"; structure: NetworkStructure }
  /** Requested or being computed by the worker. */
  | { status: "pending" }
  | { status: "failed"; message: string };

/** A row claimed by a worker that stopped answering is handed out again after this long. */
export const STALE_CLAIM_MS = 60_000;

const ready = new LruMap<NetworkStructure>(1000);

/** Records that the file's structure is wanted (nothing happens if it is already stored or requested). */
export async function requestStructure(db: DbExecutor, csv: string): Promise<void> {
  await db
    .insertInto("network_structures")
    .values({ content_hash: contentHash(csv), csv })
    .onConflict((oc) => oc.column("content_hash").doNothing())
    .execute();
}

/** The structure of each file, by content hash; files never requested before are requested now. */
export async function structureStates(db: Kysely<Database>, csvs: readonly string[]): Promise<Map<string, StructureState>> {
  const out = new Map<string, StructureState>();
  const byHash = new Map(csvs.map((csv) => [contentHash(csv), csv]));
  const missing: string[] = [];
  for (const hash of byHash.keys()) {
    const hit = ready.get(hash);
    if (hit) out.set(hash, { status: "ready", structure: hit });
    else missing.push(hash);
  }
  if (missing.length === 0) return out;
  const rows = await db.selectFrom("network_structures").select(["content_hash", "status", "structure", "problem"]).where("content_hash", "in", missing).execute();
  for (const row of rows) out.set(row.content_hash, stateOf(row));
  for (const hash of missing) {
    if (out.has(hash)) continue;
    await requestStructure(db, byHash.get(hash)!);
    out.set(hash, { status: "pending" });
  }
  return out;
}

export async function structureState(db: Kysely<Database>, csv: string): Promise<StructureState> {
  return (await structureStates(db, [csv])).get(contentHash(csv))!;
}

function stateOf(row: { content_hash: string; status: string; structure: JsonObject | null; problem: string | null }): StructureState {
  if (row.status === "ready" && row.structure) {
    const structure = row.structure as unknown as NetworkStructure;
    ready.set(row.content_hash, structure);
    return { status: "ready", structure };
  }
  if (row.status === "failed") return { status: "failed", message: row.problem ?? "The structure could not be computed." };
  return { status: "pending" };
}

/**
 * Worker side: claims the oldest open row (SKIP LOCKED, so several workers share the work),
 * computes its structure and stores it. False when there was nothing to do.
 */
export async function computeNextStructure(db: Kysely<Database>, staleAfterMs = STALE_CLAIM_MS): Promise<boolean> {
  const claimed = await sql<{ content_hash: string; csv: string }>`
    UPDATE network_structures SET status = 'computing', claimed_at = now()
    WHERE content_hash = (
      SELECT content_hash FROM network_structures
      WHERE status = 'pending' OR (status = 'computing' AND claimed_at < now() - make_interval(secs => ${staleAfterMs / 1000}))
      ORDER BY requested_at LIMIT 1 FOR UPDATE SKIP LOCKED
    )
    RETURNING content_hash, csv
  `.execute(db);
  const row = claimed.rows[0];
  if (!row) return false;
  let update: { status: "ready"; structure: JsonObject; problem: null } | { status: "failed"; structure: null; problem: string };
  try {
    const result = analyseCsv(row.csv);
    update = result.ok
      ? { status: "ready", structure: JSON.parse(JSON.stringify(result.structure)) as JsonObject, problem: null }
      : { status: "failed", structure: null, problem: result.problems[0]?.message ?? "the file does not parse" };
  } catch (err) {
    update = { status: "failed", structure: null, problem: err instanceof Error ? err.message : String(err) };
  }
  await db
    .updateTable("network_structures")
    .set({ ...update, computed_at: new Date() })
    .where("content_hash", "=", row.content_hash)
    .execute();
  return true;
}

/** Computes open rows until none is left (or `max` are done); returns how many were computed. */
export async function computePendingStructures(db: Kysely<Database>, max = Number.POSITIVE_INFINITY): Promise<number> {
  let done = 0;
  while (done < max && (await computeNextStructure(db))) done++;
  return done;
}
