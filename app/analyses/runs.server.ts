/**
 * The analyses list as a lab keeps track of it: filters and sorting read from the page's query
 * string (unknown values are ignored, never an error), and the run's own bookkeeping — name, note,
 * archive, delete. Lab ids come from the caller's permission check.
 */
import { sql } from "kysely";
import type { AnalysisStatus } from "~/db/schema";
import { ANALYSIS_STATUSES } from "~/db/schema";
import type { JobRecord } from "./repository.server";
import { isUuid } from "~/shared/uuid";
import { NAME_MAX, NOTE_MAX } from "./run-limits";
import type { DbExecutor } from "~/db/schema";
import { formatDateTime } from "~/shared/dates";

/** What the list's "kind" means for an analysis: how its rate constants and class were given. */
export type RunKind = "symbolic" | "numeric" | "class";
export const RUN_KINDS: readonly { value: RunKind; label: string }[] = [
  { value: "symbolic", label: "symbolic constants" },
  { value: "numeric", label: "numeric constants" },
  { value: "class", label: "numeric, with steady states of a class" },
];

export const SORT_KEYS = ["date", "name", "network", "version", "status", "author"] as const;
export type SortKey = (typeof SORT_KEYS)[number];

export interface RunFilter {
  networkId: string | null;
  version: number | null;
  kind: RunKind | null;
  status: AnalysisStatus | null;
  authorId: string | null;
  /** Inclusive days, YYYY-MM-DD (UTC). */
  from: string | null;
  to: string | null;
  archived: boolean;
  sort: SortKey;
  dir: "asc" | "desc";
}

const DAY = /^\d{4}-\d{2}-\d{2}$/;
const validDay = (s: string | null) => (s && DAY.test(s) && !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) ? s : null);

/** The filter in a query string such as `?network=…&status=failed&sort=author&dir=asc&archived=1`. */
export function parseRunFilter(search: URLSearchParams): RunFilter {
  const get = (k: string) => search.get(k) || null;
  const network = get("network");
  const version = Number(get("version"));
  const kind = get("kind");
  const status = get("status");
  const author = get("author");
  const sort = get("sort");
  return {
    networkId: isUuid(network) ? network : null,
    version: Number.isInteger(version) && version > 0 ? version : null,
    kind: RUN_KINDS.some((k) => k.value === kind) ? (kind as RunKind) : null,
    status: (ANALYSIS_STATUSES as readonly string[]).includes(status ?? "") ? (status as AnalysisStatus) : null,
    authorId: isUuid(author) ? author : null,
    from: validDay(get("from")),
    to: validDay(get("to")),
    archived: get("archived") === "1",
    sort: (SORT_KEYS as readonly string[]).includes(sort ?? "") ? (sort as SortKey) : "date",
    dir: get("dir") === "asc" ? "asc" : "desc",
  };
}

const SORT_COLUMN = {
  date: sql`a.created_at`,
  name: sql`lower(a.name)`,
  network: sql`lower(n.name)`,
  version: sql`v.number`,
  status: sql`a.status`,
  author: sql`lower(u.display_name)`,
} as const;

/** The lab's analyses (not their scans, tests or time courses) that pass the filter, sorted, at most 500. */
export async function listRuns(db: DbExecutor, labId: string, f: RunFilter): Promise<JobRecord[]> {
  let q = db
    .selectFrom("analyses as a")
    .innerJoin("network_versions as v", "v.id", "a.network_version_id")
    .innerJoin("networks as n", "n.id", "v.network_id")
    .leftJoin("users as u", "u.id", "a.started_by")
    .selectAll("a")
    .select(["n.id as network_id", "n.name as network_name", "v.number as version_number", "u.display_name as starter_name", "u.email as starter_email"])
    .where("a.lab_id", "=", labId)
    .where("a.kind", "=", "analysis");
  if (!f.archived) q = q.where("a.archived_at", "is", null);
  if (f.networkId) q = q.where("n.id", "=", f.networkId);
  if (f.version) q = q.where("v.number", "=", f.version);
  if (f.status) q = q.where("a.status", "=", f.status);
  if (f.authorId) q = q.where("a.started_by", "=", f.authorId);
  if (f.from) q = q.where("a.created_at", ">=", new Date(`${f.from}T00:00:00Z`));
  if (f.to) q = q.where("a.created_at", "<", new Date(Date.parse(`${f.to}T00:00:00Z`) + 86_400_000));
  if (f.kind === "symbolic") q = q.where(sql<boolean>`a.params->>'rateMode' = 'symbolic'`);
  if (f.kind === "numeric") q = q.where(sql<boolean>`a.params->>'rateMode' = 'numeric' AND jsonb_typeof(a.params->'initial') IS DISTINCT FROM 'object'`);
  if (f.kind === "class") q = q.where(sql<boolean>`a.params->>'rateMode' = 'numeric' AND jsonb_typeof(a.params->'initial') = 'object'`);
  const dir = f.dir === "asc" ? sql`ASC` : sql`DESC`;
  // Ties (same network, same author) fall back to newest first, so the order is stable.
  return (await q.orderBy(sql`${SORT_COLUMN[f.sort]} ${dir} NULLS LAST`).orderBy("a.created_at", "desc").orderBy("a.id").limit(500).execute()) as JobRecord[];
}

/** What the filter menus offer: the lab's networks and the people who started its analyses. */
export async function runFilterChoices(db: DbExecutor, labId: string) {
  const [networks, authors] = await Promise.all([
    db.selectFrom("networks").select(["id", "name"]).where("lab_id", "=", labId).orderBy("name").execute(),
    db
      .selectFrom("analyses as a")
      .innerJoin("users as u", "u.id", "a.started_by")
      .select(["u.id", "u.display_name as name"])
      .distinct()
      .where("a.lab_id", "=", labId)
      .where("a.kind", "=", "analysis")
      .orderBy("u.display_name")
      .execute(),
  ]);
  return { networks, authors };
}

export { NAME_MAX, NOTE_MAX };

export type DetailsParse = { ok: true; name: string; note: string } | { ok: false; problems: { field: string; message: string }[] };

/** A run's name (one line, up to 120 characters, may be empty) and note (up to 4000 characters). */
export function parseRunDetails(input: { name: unknown; note: unknown }): DetailsParse {
  const name = typeof input.name === "string" ? input.name.trim() : "";
  const note = typeof input.note === "string" ? input.note.replace(/\r\n/g, "\n").trim() : "";
  const problems = [];
  if (name.length > NAME_MAX) problems.push({ field: "name", message: `the name has ${name.length} characters; at most ${NAME_MAX}` });
  if (/[\n\r\t]/.test(name)) problems.push({ field: "name", message: "the name is one line (no line breaks or tabs)" });
  if (note.length > NOTE_MAX) problems.push({ field: "note", message: `the note has ${note.length} characters; at most ${NOTE_MAX}` });
  return problems.length > 0 ? { ok: false, problems } : { ok: true, name, note };
}

export async function setRunDetails(db: DbExecutor, id: string, details: { name: string; note: string }): Promise<void> {
  await db.updateTable("analyses").set(details).where("id", "=", id).where("kind", "=", "analysis").execute();
}

export async function setRunArchived(db: DbExecutor, id: string, archived: boolean): Promise<void> {
  await db
    .updateTable("analyses")
    .set({ archived_at: archived ? sql`coalesce(archived_at, now())` : null })
    .where("id", "=", id)
    .execute();
}

/**
 * Deletes an analysis with its scans, tests, time courses and share links (foreign keys cascade).
 * A run still waiting or running is refused: cancel it first, so no worker writes into a deleted row's place.
 */
export async function deleteRun(db: DbExecutor, id: string): Promise<{ ok: true } | { ok: false; message: string }> {
  const busy = await db
    .selectFrom("analyses")
    .select("id")
    .where((eb) => eb.or([eb("id", "=", id), eb("parent_id", "=", id)]))
    .where("status", "in", ["queued", "running"])
    .executeTakeFirst();
  if (busy) return { ok: false, message: "This analysis (or one of its scans, tests or time courses) is still waiting or running; cancel it first." };
  await db.deleteFrom("analyses").where("id", "=", id).execute();
  return { ok: true };
}

/** The label a run goes by: its name, else the network, version and start time. */
export function runLabel(j: { name: string; network_name: string; version_number: number; created_at: Date }): string {
  return j.name || `${j.network_name} v${j.version_number}, ${formatDateTime(j.created_at)}`;
}
