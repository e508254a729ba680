/**
 * Row types for what migration 20261201234500_analyses adds, layered over the foundation's
 * `Database` (a thin adapter so this feature owns its own columns and tables).
 */
import type { ColumnType, Generated, Kysely, Selectable, Transaction } from "kysely";
import type { AnalysesTable, Database, JsonObject } from "~/db/schema";

type Timestamp = ColumnType<Date, Date | string, Date | string>;
type NullableTimestamp = ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;

export type JobKind = "analysis" | "scan" | "relation" | "timecourse";
export const JOB_KINDS: readonly JobKind[] = ["analysis", "scan", "relation", "timecourse"];

export interface JobAnalysesTable extends AnalysesTable {
  kind: ColumnType<JobKind, JobKind | undefined, JobKind>;
  parent_id: string | null;
  attempts: Generated<number>;
  max_attempts: Generated<number>;
  heartbeat_at: NullableTimestamp;
  worker_id: string | null;
  cancel_requested_at: NullableTimestamp;
  time_limit_seconds: Generated<number>;
  notify_by_email: Generated<boolean>;
  /** Migration 20261202130000_analysis_runs: the run's own name and note ("" when none). */
  name: Generated<string>;
  note: Generated<string>;
  archived_at: NullableTimestamp;
  /** What a cancelled or timed-out run had finished (the analysis result's shape with `unfinished[]`). */
  partial_result: ColumnType<JsonObject | null, JsonObject | null | undefined, JsonObject | null>;
}

export interface AnalysisShareLinksTable {
  id: Generated<string>;
  analysis_id: string;
  /** SHA-256 hex of the token; the token itself is shown once. */
  token_hash: string;
  created_by: string | null;
  created_at: ColumnType<Date, Date | string | undefined, never>;
  expires_at: Timestamp;
  revoked_at: NullableTimestamp;
}

export interface LabAnalysisSettingsTable {
  lab_id: string;
  max_time_limit_seconds: Generated<number>;
  max_basis_size: Generated<number>;
  updated_at: Generated<Date>;
}

export interface AnalysesDatabase extends Omit<Database, "analyses"> {
  analyses: JobAnalysesTable;
  analysis_share_links: AnalysisShareLinksTable;
  lab_analysis_settings: LabAnalysisSettingsTable;
}

export type JobRow = Selectable<JobAnalysesTable>;
export type ShareLinkRow = Selectable<AnalysisShareLinksTable>;
export type AnalysesDb = Kysely<AnalysesDatabase> | Transaction<AnalysesDatabase>;

/** The same pool, seen with this feature's columns. */
export const asAnalysesDb = (db: Kysely<Database>): Kysely<AnalysesDatabase> => db as unknown as Kysely<AnalysesDatabase>;
