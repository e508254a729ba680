/**
 * Request bodies of the networks JSON API. A network can arrive as JSON
 * (`{ "name", "csv", "description"?, "tags"?, "changeNote"? }`), as a multipart upload (a `file`
 * part plus the same fields), or as a raw `text/csv` body with the fields in the query string.
 * SBML and reaction lists come the same ways (issue 14): JSON `sbml` or `reactions` instead of
 * `csv`, a `file` part named `.xml`/`.sbml`/`.txt`, or an `application/sbml+xml` body; each is read
 * into our CSV first, and its problems answer 400 with their lines (and SBML element ids).
 */
import { apiError } from "~/permissions/api-errors";
import { MAX_CSV_BYTES, MAX_CSV_LABEL } from "./grid";
import type { SaveFailure } from "./save.server";
import { importFormat, importNetworkText } from "./import-file";
import { requireBody } from "~/api/body";
import { decodeNetworkFile } from "@domain/network/index";
import { NETWORK_CREATE, VERSION_CREATE } from "~/api/schemas";

export interface NetworkPayload {
  name?: unknown;
  description?: unknown;
  tags?: unknown;
  csv?: unknown;
  changeNote?: unknown;
}

export async function readNetworkPayload(request: Request, kind: "network" | "version" = "network"): Promise<NetworkPayload> {
  const length = Number(request.headers.get("content-length") ?? 0);
  // Multipart framing and JSON escaping add a little; refuse clearly oversized bodies unread.
  if (length > MAX_CSV_BYTES * 2 + 64 * 1024) throw apiError("payload_too_large", `The request body is too large; network files are at most ${MAX_CSV_LABEL}.`, { limitBytes: MAX_CSV_BYTES });
  const type = (request.headers.get("content-type") ?? "").toLowerCase();
  if (type.startsWith("application/json")) {
    let body: unknown;
    try {
      body = await request.json();
    } catch {
      throw apiError("invalid_request", "The body is not valid JSON.");
    }
    if (typeof body !== "object" || body === null || Array.isArray(body)) throw apiError("invalid_request", "The JSON body must be an object such as { \"name\": …, \"csv\": … }.");
    // The schema published in /api/openapi.json is the one checked here (field types).
    const b = requireBody(kind === "network" ? NETWORK_CREATE : VERSION_CREATE, body) as NetworkPayload & { sbml?: unknown; reactions?: unknown };
    if (b.csv === undefined && typeof b.sbml === "string") return { ...b, csv: imported(b.sbml, "sbml") };
    if (b.csv === undefined && typeof b.reactions === "string") return { ...b, csv: imported(b.reactions, "text") };
    return b;
  }
  if (type.startsWith("multipart/form-data") || type.startsWith("application/x-www-form-urlencoded")) {
    const form = await request.formData();
    const file = form.get("file") ?? form.get("csv");
    const raw = typeof file === "string" ? file : file ? await fileText(await file.arrayBuffer(), file.name) : undefined;
    const csv = raw === undefined ? undefined : convert(raw, file && typeof file !== "string" ? file.name : undefined, file && typeof file !== "string" ? file.type : undefined);
    const text = (k: string) => (typeof form.get(k) === "string" ? (form.get(k) as string) : undefined);
    const name = text("name") ?? (file && typeof file !== "string" ? file.name.replace(/\.[^.]*$/, "") : undefined);
    return { name, description: text("description"), tags: text("tags"), changeNote: text("changeNote"), csv };
  }
  const sbml = ["application/sbml+xml", "application/xml", "text/xml"].some((t) => type.startsWith(t));
  if (type.startsWith("text/csv") || type.startsWith("text/plain") || sbml) {
    const q = new URL(request.url).searchParams;
    const body = await fileText(await request.arrayBuffer(), "The request body");
    return {
      name: q.get("name") ?? undefined,
      description: q.get("description") ?? undefined,
      tags: q.get("tags") ?? undefined,
      changeNote: q.get("changeNote") ?? undefined,
      csv: sbml ? imported(body, "sbml") : q.get("format") === "text" ? imported(body, "text") : body,
    };
  }
  throw apiError("invalid_request", "Send JSON, multipart/form-data (a `file` part), text/csv or application/sbml+xml.", { contentType: type || null });
}

/**
 * An uploaded file's bytes as text: a binary file or one in another encoding is refused here with
 * one located problem (decodeNetworkFile), before any reader could echo its bytes back.
 */
async function fileText(bytes: ArrayBuffer, what: string): Promise<string> {
  if (bytes.byteLength > MAX_CSV_BYTES) throw apiError("payload_too_large", `${what} is ${Math.ceil(bytes.byteLength / 1024)} KB; network files are at most ${MAX_CSV_LABEL}.`, { limitBytes: MAX_CSV_BYTES });
  const decoded = decodeNetworkFile(new Uint8Array(bytes));
  if (!decoded.ok) throw apiError("invalid_request", `${what}: ${decoded.problem.message}; nothing was saved.`, { problems: [decoded.problem] });
  return decoded.text;
}

/** An uploaded file as our CSV: SBML and reaction lists are read first; CSV passes unchanged. */
function convert(text: string, fileName: string | undefined, contentType: string | undefined): string {
  const format = importFormat(fileName, contentType, text);
  return format === "csv" ? text : imported(text, format);
}

function imported(text: string, format: "sbml" | "text" | "csv"): string {
  const r = importNetworkText(text, format);
  if (!r.ok) throw apiError("invalid_request", r.message, { format: r.format, problems: r.problems, ...(r.reactions ? { reactions: r.reactions } : {}), notes: r.notes });
  return r.csv;
}

/** A refused save in the API's error shape; CSV problems keep their row and column. */
export function saveFailureResponse(failure: SaveFailure): Response {
  return apiError(failure.code, failure.message, failure.details);
}
