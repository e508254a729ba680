/**
 * Request bodies of the networks JSON API. A network can arrive as JSON
 * (`{ "name", "csv", "description"?, "tags"?, "changeNote"? }`), as a multipart upload (a `file`
 * part plus the same fields), or as a raw `text/csv` body with the fields in the query string.
 */
import { apiError } from "~/permissions/api-errors";
import { MAX_CSV_BYTES, MAX_CSV_LABEL } from "./grid";
import type { SaveFailure } from "./save.server";

export interface NetworkPayload {
  name?: unknown;
  description?: unknown;
  tags?: unknown;
  csv?: unknown;
  changeNote?: unknown;
}

export async function readNetworkPayload(request: Request): Promise<NetworkPayload> {
  const length = Number(request.headers.get("content-length") ?? 0);
  // Multipart framing and JSON escaping add a little; refuse clearly oversized bodies unread.
  if (length > MAX_CSV_BYTES * 2 + 64 * 1024) throw apiError("invalid_request", `The request body is too large; network files are at most ${MAX_CSV_LABEL}.`);
  const type = (request.headers.get("content-type") ?? "").toLowerCase();
  if (type.startsWith("application/json")) {
    let body: unknown;
    try {
      body = await request.json();
    } catch {
      throw apiError("invalid_request", "The body is not valid JSON.");
    }
    if (typeof body !== "object" || body === null || Array.isArray(body)) throw apiError("invalid_request", "The JSON body must be an object such as { \"name\": …, \"csv\": … }.");
    return body as NetworkPayload;
  }
  if (type.startsWith("multipart/form-data") || type.startsWith("application/x-www-form-urlencoded")) {
    const form = await request.formData();
    const file = form.get("file") ?? form.get("csv");
    const csv = typeof file === "string" ? file : file ? await file.text() : undefined;
    const text = (k: string) => (typeof form.get(k) === "string" ? (form.get(k) as string) : undefined);
    const name = text("name") ?? (file && typeof file !== "string" ? file.name.replace(/\.[^.]*$/, "") : undefined);
    return { name, description: text("description"), tags: text("tags"), changeNote: text("changeNote"), csv };
  }
  if (type.startsWith("text/csv") || type.startsWith("text/plain")) {
    const q = new URL(request.url).searchParams;
    return { name: q.get("name") ?? undefined, description: q.get("description") ?? undefined, tags: q.get("tags") ?? undefined, changeNote: q.get("changeNote") ?? undefined, csv: await request.text() };
  }
  throw apiError("invalid_request", "Send JSON, multipart/form-data (a `file` part) or text/csv.", { contentType: type || null });
}

/** A refused save in the API's error shape; CSV problems keep their row and column. */
export function saveFailureResponse(failure: SaveFailure): Response {
  return apiError(failure.code, failure.message, failure.details);
}
