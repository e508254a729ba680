/**
 * Network rows and their immutable versions. Free functions taking `db`/`trx` first; each
 * function's lab or network id comes from a permission check made by the caller.
 */
import { createHash } from "node:crypto";
import type { Kysely } from "kysely";
import type { Database, DbExecutor } from "~/db/schema";
import { recordAudit } from "~/shared/audit.server";
import { isUuid } from "~/shared/uuid";
import { requestStructure } from "./structure-store.server";

export const contentHash = (csv: string) => createHash("sha256").update(csv, "utf8").digest("hex");


export interface NetworkRecord {
  id: string;
  labId: string;
  name: string;
  description: string;
  tags: string[];
  archivedAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
  createdBy: string | null;
}

export interface VersionRecord {
  id: string;
  networkId: string;
  number: number;
  contentHash: string;
  csv: string;
  changeNote: string;
  authorId: string | null;
  authorName: string | null;
  createdAt: Date;
}

/** A network with its newest version, for the lab's list. */
export interface NetworkListEntry extends NetworkRecord {
  versionCount: number;
  latest: VersionRecord;
}

const networkColumns = ["n.id", "n.lab_id", "n.name", "n.description", "n.tags", "n.archived_at", "n.created_at", "n.updated_at", "n.created_by"] as const;

function toNetwork(r: {
  id: string;
  lab_id: string;
  name: string;
  description: string;
  tags: string[];
  archived_at: Date | null;
  created_at: Date;
  updated_at: Date;
  created_by: string | null;
}): NetworkRecord {
  return {
    id: r.id,
    labId: r.lab_id,
    name: r.name,
    description: r.description,
    tags: r.tags,
    archivedAt: r.archived_at,
    createdAt: r.created_at,
    updatedAt: r.updated_at,
    createdBy: r.created_by,
  };
}

function versionQuery(db: DbExecutor) {
  return db
    .selectFrom("network_versions as v")
    .leftJoin("users as u", "u.id", "v.author_id")
    .select(["v.id", "v.network_id", "v.number", "v.content_hash", "v.csv", "v.change_note", "v.author_id", "v.created_at", "u.display_name as author_name"]);
}

function toVersion(r: {
  id: string;
  network_id: string;
  number: number;
  content_hash: string;
  csv: string;
  change_note: string;
  author_id: string | null;
  created_at: Date;
  author_name: string | null;
}): VersionRecord {
  return {
    id: r.id,
    networkId: r.network_id,
    number: r.number,
    contentHash: r.content_hash,
    csv: r.csv,
    changeNote: r.change_note,
    authorId: r.author_id,
    authorName: r.author_name,
    createdAt: r.created_at,
  };
}

/**
 * Networks joined to their newest version and its author, in one query: a lateral join picks the
 * highest version number per network (the list and the API read it on every request).
 */
function withLatestVersion(db: DbExecutor) {
  return db
    .selectFrom("networks as n")
    .innerJoinLateral(
      (eb) => eb.selectFrom("network_versions as lv").selectAll("lv").whereRef("lv.network_id", "=", "n.id").orderBy("lv.number", "desc").limit(1).as("v"),
      (join) => join.onTrue(),
    )
    .leftJoin("users as u", "u.id", "v.author_id")
    .select(networkColumns)
    .select(["v.id as v_id", "v.number", "v.content_hash", "v.csv", "v.change_note", "v.author_id", "v.created_at as v_created_at", "u.display_name as author_name"]);
}

/**
 * The lab's networks with each one's newest version and version count, by name: one query (a
 * lateral join picks the newest version per network), since the lab's list runs it on every view.
 */
export async function listNetworks(db: DbExecutor, labId: string, options: { includeArchived?: boolean } = {}): Promise<NetworkListEntry[]> {
  let q = withLatestVersion(db)
    .select((eb) => eb.selectFrom("network_versions as c").select(eb.fn.countAll<string>().as("n")).whereRef("c.network_id", "=", "n.id").as("version_count"))
    .where("n.lab_id", "=", labId);
  if (!options.includeArchived) q = q.where("n.archived_at", "is", null);
  // A network without versions cannot be made through the app; the inner join skips one left by hand.
  const rows = await q.orderBy("n.name").execute();
  return rows.map((r) => ({
    ...toNetwork(r),
    versionCount: Number(r.version_count ?? 0),
    latest: toVersion({ ...r, id: r.v_id, network_id: r.id, created_at: r.v_created_at }),
  }));
}

/** The network in this lab with its newest version, in one query; undefined as for findNetwork. */
export async function findNetworkWithLatest(db: DbExecutor, labId: string, networkId: string | undefined): Promise<{ network: NetworkRecord; latest: VersionRecord } | undefined> {
  if (!isUuid(networkId)) return undefined;
  const row = await withLatestVersion(db)
    .where("n.id", "=", networkId)
    .where("n.lab_id", "=", labId)
    .executeTakeFirst();
  return row && { network: toNetwork(row), latest: toVersion({ ...row, id: row.v_id, network_id: row.id, created_at: row.v_created_at }) };
}

/** The network in this lab, or undefined (also for a malformed id). */
export async function findNetwork(db: DbExecutor, labId: string, networkId: string | undefined): Promise<NetworkRecord | undefined> {
  if (!isUuid(networkId)) return undefined;
  const row = await db.selectFrom("networks as n").select(networkColumns).where("n.id", "=", networkId).where("n.lab_id", "=", labId).executeTakeFirst();
  return row && toNetwork(row);
}

export async function listVersions(db: DbExecutor, networkId: string): Promise<VersionRecord[]> {
  return (await versionQuery(db).where("v.network_id", "=", networkId).orderBy("v.number", "desc").execute()).map(toVersion);
}

export async function findVersion(db: DbExecutor, networkId: string, number: number): Promise<VersionRecord | undefined> {
  if (!Number.isSafeInteger(number) || number < 1) return undefined;
  const row = await versionQuery(db).where("v.network_id", "=", networkId).where("v.number", "=", number).executeTakeFirst();
  return row && toVersion(row);
}

export async function latestVersion(db: DbExecutor, networkId: string): Promise<VersionRecord | undefined> {
  const row = await versionQuery(db).where("v.network_id", "=", networkId).orderBy("v.number", "desc").limit(1).executeTakeFirst();
  return row && toVersion(row);
}

export async function findVersionByHash(db: DbExecutor, networkId: string, hash: string): Promise<VersionRecord | undefined> {
  const row = await versionQuery(db).where("v.network_id", "=", networkId).where("v.content_hash", "=", hash).executeTakeFirst();
  return row && toVersion(row);
}

export interface NewNetworkInput {
  labId: string;
  name: string;
  description: string;
  tags: string[];
  csv: string;
  changeNote: string;
  authorId: string;
}

/** Inserts the network and its version 1 in one transaction. */
export async function insertNetwork(db: Kysely<Database>, input: NewNetworkInput): Promise<{ network: NetworkRecord; version: VersionRecord }> {
  return db.transaction().execute(async (trx) => {
    const row = await trx
      .insertInto("networks")
      .values({ lab_id: input.labId, name: input.name, description: input.description, tags: input.tags, created_by: input.authorId })
      .returning(["id", "lab_id", "name", "description", "tags", "archived_at", "created_at", "updated_at", "created_by"])
      .executeTakeFirstOrThrow();
    const version = await insertVersionRow(trx, row.id, 1, input);
    // Uploads are part of the lab's trail (the name is kept, so the line still reads after a rename or delete).
    await trx
      .insertInto("audit_events")
      .values({ kind: "network.created", actor_id: input.authorId, lab_id: input.labId, details: { networkId: row.id, name: row.name, version: 1 } })
      .execute();
    return { network: toNetwork(row), version };
  });
}

async function insertVersionRow(trx: DbExecutor, networkId: string, number: number, input: { csv: string; changeNote: string; authorId: string }) {
  const inserted = await trx
    .insertInto("network_versions")
    .values({ network_id: networkId, number, content_hash: contentHash(input.csv), csv: input.csv, change_note: input.changeNote, author_id: input.authorId })
    .returning("id")
    .executeTakeFirstOrThrow();
  // The worker computes the structure (structure-store.server.ts); asked for with the version itself.
  await requestStructure(trx, input.csv);
  const row = await versionQuery(trx).where("v.id", "=", inserted.id).executeTakeFirstOrThrow();
  return toVersion(row);
}

/**
 * Appends the next version. The network row is locked first, so two saves at once get
 * consecutive numbers instead of a unique-key error.
 */
export async function appendVersion(
  db: Kysely<Database>,
  networkId: string,
  input: { csv: string | ((number: number) => string); changeNote: string; authorId: string },
): Promise<VersionRecord> {
  return db.transaction().execute(async (trx) => {
    const network = await trx.selectFrom("networks").select(["id", "lab_id", "name"]).where("id", "=", networkId).forUpdate().executeTakeFirstOrThrow();
    const max = await trx
      .selectFrom("network_versions")
      .select(({ fn }) => fn.max("number").as("m"))
      .where("network_id", "=", networkId)
      .executeTakeFirst();
    const number = (max?.m ?? 0) + 1;
    const csv = typeof input.csv === "function" ? input.csv(number) : input.csv;
    const version = await insertVersionRow(trx, networkId, number, { ...input, csv });
    await trx.updateTable("networks").set({ updated_at: new Date() }).where("id", "=", networkId).execute();
    await trx
      .insertInto("audit_events")
      .values({
        kind: "network.version_saved",
        actor_id: input.authorId,
        lab_id: network.lab_id,
        details: { networkId, name: network.name, version: number, changeNote: input.changeNote },
      })
      .execute();
    return version;
  });
}

export async function updateNetworkDetails(db: DbExecutor, networkId: string, details: { name: string; description: string; tags: string[] }) {
  await db.updateTable("networks").set({ ...details, updated_at: new Date() }).where("id", "=", networkId).execute();
}

export async function setArchived(db: DbExecutor, networkId: string, archived: boolean) {
  await db
    .updateTable("networks")
    .set({ archived_at: archived ? new Date() : null, updated_at: new Date() })
    .where("id", "=", networkId)
    .execute();
}

/** Removes the network, its versions and their analyses (foreign keys cascade), and notes it in the audit log. */
export async function deleteNetwork(db: Kysely<Database>, network: NetworkRecord, actorId: string) {
  await db.transaction().execute(async (trx) => {
    await trx.deleteFrom("networks").where("id", "=", network.id).execute();
    await recordAudit(trx, { kind: "network.deleted", actorId, labId: network.labId, details: { networkId: network.id, name: network.name } });
  });
}
