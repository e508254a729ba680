/**
 * Creating networks and saving versions: every input checked (the domain parser is the authority
 * on the CSV), nothing invalid stored. Returns outcomes rather than throwing, so the form can
 * keep the person's edits and the API can answer in its one error shape.
 */
import type { Kysely } from "kysely";
import type { NetworkFileProblem } from "@domain/network/index";
import type { Database } from "~/db/schema";
import type { ApiErrorCode } from "~/permissions/api-errors";
import { MAX_CSV_BYTES, MAX_CSV_LABEL } from "./grid";
import { checkNetworkFile } from "./structure.server";
import {
  appendVersion,
  findVersion,
  findVersionByHash,
  contentHash,
  insertNetwork,
  latestVersion,
  type NetworkRecord,
  type VersionRecord,
} from "./networks.server";

export interface SaveFailure {
  ok: false;
  code: ApiErrorCode;
  message: string;
  /** Located CSV problems and/or field messages. */
  details?: { problems?: NetworkFileProblem[]; fields?: Record<string, string> };
}
export type SaveResult<T> = ({ ok: true } & T) | SaveFailure;

export interface NetworkDetails {
  name: string;
  description: string;
  tags: string[];
}

const MAX_NAME = 200;
const MAX_DESCRIPTION = 5000;
const MAX_NOTE = 500;
const MAX_TAGS = 12;
const TAG = /^[\p{L}\p{N}][\p{L}\p{N} _.-]{0,39}$/u;

/**
 * PostgreSQL cannot store a NUL character in text or JSON, and no name or note needs one (nor any
 * other control character except tab and line breaks, which descriptions and notes may hold).
 */
const CONTROL = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/;
const controlMessage = (what: string) => `${what} contains a control character (such as NUL); remove it.`;

/** Line and column (1-based) of the first NUL character in a CSV text, if any. */
function nulPosition(csv: string): { row: number; columnIndex: number } | undefined {
  const at = csv.indexOf("\u0000");
  if (at < 0) return undefined;
  const before = csv.slice(0, at);
  const row = before.split("\n").length;
  const line = before.slice(before.lastIndexOf("\n") + 1);
  return { row, columnIndex: line.split(",").length };
}

/** Tags from `enzyme, Teaching` or an array: trimmed, lower-case, without repeats. */
export function parseTags(raw: unknown): { ok: true; tags: string[] } | { ok: false; message: string } {
  const list = Array.isArray(raw) ? raw : typeof raw === "string" ? raw.split(",") : raw == null ? [] : null;
  if (list === null || list.some((t) => typeof t !== "string")) return { ok: false, message: "Tags must be text, separated by commas." };
  const tags = [...new Set((list as string[]).map((t) => t.trim().toLowerCase()).filter(Boolean))];
  const bad = tags.find((t) => !TAG.test(t));
  if (bad) return { ok: false, message: `Tag “${bad}” is not allowed: up to 40 letters, digits, spaces, “-”, “_” or “.”.` };
  if (tags.length > MAX_TAGS) return { ok: false, message: `At most ${MAX_TAGS} tags.` };
  return { ok: true, tags };
}

export function parseDetails(input: { name?: unknown; description?: unknown; tags?: unknown }): SaveResult<{ details: NetworkDetails }> {
  const fields: Record<string, string> = {};
  const name = typeof input.name === "string" ? input.name.trim() : "";
  if (name === "") fields.name = "Give the network a name.";
  else if (name.length > MAX_NAME) fields.name = `Names are at most ${MAX_NAME} characters.`;
  else if (CONTROL.test(name) || /[\n\r\t]/.test(name)) fields.name = controlMessage("The name");
  const description = typeof input.description === "string" ? input.description.trim() : input.description == null ? "" : null;
  if (description === null) fields.description = "The description must be text.";
  else if (description.length > MAX_DESCRIPTION) fields.description = `Descriptions are at most ${MAX_DESCRIPTION} characters.`;
  else if (CONTROL.test(description)) fields.description = controlMessage("The description");
  const tags = parseTags(input.tags);
  if (!tags.ok) fields.tags = tags.message;
  if (Object.keys(fields).length > 0) return { ok: false, code: "invalid_request", message: Object.values(fields)[0]!, details: { fields } };
  return { ok: true, details: { name, description: description!, tags: tags.ok ? tags.tags : [] } };
}

export function parseChangeNote(raw: unknown, fallback: string): SaveResult<{ note: string }> {
  const note = typeof raw === "string" ? raw.trim() : raw == null ? "" : null;
  if (note === null || note.length > MAX_NOTE) {
    return { ok: false, code: "invalid_request", message: `The change note is text of at most ${MAX_NOTE} characters.`, details: { fields: { changeNote: "Too long." } } };
  }
  if (CONTROL.test(note)) {
    return { ok: false, code: "invalid_request", message: controlMessage("The change note"), details: { fields: { changeNote: controlMessage("The change note") } } };
  }
  return { ok: true, note: note === "" ? fallback : note };
}

/** The CSV must fit the size limit and parse without a single problem. */
export function checkCsv(csv: unknown): SaveResult<{ csv: string }> {
  if (typeof csv !== "string" || csv.trim() === "") {
    return { ok: false, code: "invalid_request", message: "The network is empty: give at least one reaction.", details: { problems: [{ row: 1, message: "the file is empty", expected: "a header such as `reaction,rate` and one reaction per row" }] } };
  }
  if (new TextEncoder().encode(csv).length > MAX_CSV_BYTES) {
    return { ok: false, code: "payload_too_large", message: `The network file is larger than ${MAX_CSV_LABEL}.`, details: { fields: { csv: `At most ${MAX_CSV_LABEL}.` } } };
  }
  const nul = nulPosition(csv);
  if (nul) {
    return { ok: false, code: "invalid_request", message: "The network file contains a NUL character; nothing was saved.", details: { problems: [{ ...nul, message: "a NUL character", expected: "text without control characters" }] } };
  }
  // Parse and size limits only: the structure is the worker's (structure-store.server.ts).
  const analysis = checkNetworkFile(csv);
  if (!analysis.ok) {
    const n = analysis.problems.length;
    return { ok: false, code: "invalid_request", message: `The network file has ${n} problem${n === 1 ? "" : "s"}; nothing was saved.`, details: { problems: [...analysis.problems] } };
  }
  return { ok: true, csv };
}

export async function createNetwork(
  db: Kysely<Database>,
  input: { labId: string; authorId: string; name?: unknown; description?: unknown; tags?: unknown; csv: unknown; changeNote?: unknown },
): Promise<SaveResult<{ network: NetworkRecord; version: VersionRecord }>> {
  const details = parseDetails(input);
  const csv = checkCsv(input.csv);
  const note = parseChangeNote(input.changeNote, "First version.");
  if (!details.ok || !csv.ok || !note.ok) return mergeFailures([details, csv, note]);
  const created = await insertNetwork(db, { labId: input.labId, authorId: input.authorId, ...details.details, csv: csv.csv, changeNote: note.note });
  return { ok: true, ...created };
}

/** Saves `csv` as the next version; refuses content equal to the newest version or an older one. */
export async function saveVersion(
  db: Kysely<Database>,
  network: NetworkRecord,
  input: { authorId: string; csv: unknown; changeNote?: unknown },
): Promise<SaveResult<{ version: VersionRecord }>> {
  const csv = checkCsv(input.csv);
  const note = parseChangeNote(input.changeNote, "Edited.");
  if (!csv.ok || !note.ok) return mergeFailures([csv, note]);
  const same = await findVersionByHash(db, network.id, contentHash(csv.csv));
  if (same) {
    const latest = await latestVersion(db, network.id);
    return {
      ok: false,
      code: "conflict",
      message:
        same.number === latest?.number
          ? `Nothing changed: this is exactly version ${same.number}.`
          : `This is exactly version ${same.number}; restore that version instead of saving it again.`,
      details: { fields: { csv: `identical to version ${same.number}` } },
    };
  }
  const version = await appendVersion(db, network.id, { csv: csv.csv, changeNote: note.note, authorId: input.authorId });
  return { ok: true, version };
}

const RESTORED = /^# Restored from version \d+ as version \d+\.\n/;

/**
 * Restores version `number` as a new version. Its CSV gains a first comment line naming both
 * versions: versions are unique by content, and the line says where the content came from.
 */
export async function restoreVersion(
  db: Kysely<Database>,
  network: NetworkRecord,
  input: { authorId: string; number: number },
): Promise<SaveResult<{ version: VersionRecord }>> {
  const old = await findVersion(db, network.id, input.number);
  if (!old) return { ok: false, code: "not_found", message: `There is no version ${input.number}.` };
  const latest = await latestVersion(db, network.id);
  if (latest && latest.csv.replace(RESTORED, "") === old.csv.replace(RESTORED, "")) {
    return { ok: false, code: "conflict", message: `The newest version already has the content of version ${old.number}.` };
  }
  const body = old.csv.replace(RESTORED, "");
  const version = await appendVersion(db, network.id, {
    csv: (n) => `# Restored from version ${old.number} as version ${n}.\n${body}`,
    changeNote: `Restored version ${old.number}.`,
    authorId: input.authorId,
  });
  return { ok: true, version };
}

function mergeFailures(results: (SaveResult<object> | { ok: true })[]): SaveFailure {
  const failures = results.filter((r): r is SaveFailure => !r.ok);
  const fields = Object.assign({}, ...failures.map((f) => f.details?.fields ?? {})) as Record<string, string>;
  const problems = failures.flatMap((f) => f.details?.problems ?? []);
  const details: SaveFailure["details"] = {};
  if (problems.length > 0) details.problems = problems;
  if (Object.keys(fields).length > 0) details.fields = fields;
  // A body over the size limit is answered 413 whatever else is wrong with it.
  const code = failures.some((f) => f.code === "payload_too_large") ? "payload_too_large" : "invalid_request";
  return { ok: false, code, message: failures.map((f) => f.message).join(" "), details };
}
