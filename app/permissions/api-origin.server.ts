import { getEnv } from "~/env.server";
import { apiError } from "./api-errors";
import { CROSS_ORIGIN_MESSAGE, crossOriginWrite, SAFE_METHODS } from "./same-origin";

/**
 * Cookie-authenticated writes to the JSON API must come from our own pages. A browser attaches
 * the session cookie to a form, multipart or `text/plain` POST from any page (a site on another
 * port of the same host is "same-site", so SameSite=Lax does not stop it), so such a write must
 * (1) declare `Content-Type: application/json`, which no cross-origin page can send without a
 * CORS preflight we never answer, and (2) carry an `Origin` (or `Sec-Fetch-Site`) naming this
 * site when the browser sends one (same-origin.ts; the production server checks (2) for every
 * write, pages included, and this repeats it so the API holds under any server). Bearer-token clients are not affected: a token is never
 * attached by a browser on its own. Reads (GET/HEAD/OPTIONS) pass.
 *
 *   POST /api/labs/x/networks, Cookie, Content-Type: text/plain         → 415 unsupported_media_type
 *   POST …, Cookie, Content-Type: application/json, Origin: http://h:4000 → 403 cross_origin
 */
export function assertCookieWriteAllowed(request: Request): void {
  if (SAFE_METHODS.has(request.method.toUpperCase())) return;
  const foreign = crossOriginWrite(request.method, { origin: request.headers.get("origin"), fetchSite: request.headers.get("sec-fetch-site") }, ownOrigins(request));
  if (foreign) throw apiError("cross_origin", CROSS_ORIGIN_MESSAGE, foreign);
  const type = (request.headers.get("content-type") ?? "").split(";")[0]!.trim().toLowerCase();
  if (type !== "application/json") {
    throw apiError("unsupported_media_type", "Writes signed in with the session cookie must send Content-Type: application/json (uploads with a file need an API token).", { contentType: type || null });
  }
}

/** This site's origins: the public APP_URL, and the origin the request arrived on. */
function ownOrigins(request: Request): Set<string> {
  const own = new Set<string>([new URL(request.url).origin]);
  try {
    own.add(new URL(getEnv().appUrl).origin);
  } catch {
    /* APP_URL is validated at start; nothing to add */
  }
  return own;
}
