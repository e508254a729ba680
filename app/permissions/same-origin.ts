/**
 * Is a write coming from one of this site's own pages? A browser attaches the session cookie to a
 * form post from any page, and a site on another port of the same host is "same-site", so
 * SameSite=Lax does not stop it. Browsers name the page's origin in `Origin` on every POST (and
 * say `Sec-Fetch-Site`), so a write whose Origin is not ours is refused; one with neither header
 * (a script, curl) is not a browser acting for someone else and passes. Reads never change
 * anything and always pass. Used by the production server for every request (scripts/serve.ts)
 * and by the JSON API's cookie check (api-origin.server.ts).
 *
 *   crossOriginWrite("POST", { origin: "http://127.0.0.1:4000" }, ["http://127.0.0.1:3000"])
 *   // → { origin: "http://127.0.0.1:4000" }
 *   crossOriginWrite("POST", { origin: "http://127.0.0.1:3000" }, ["http://127.0.0.1:3000"]) // → undefined
 */
export const SAFE_METHODS: ReadonlySet<string> = new Set(["GET", "HEAD", "OPTIONS"]);

export type CrossOrigin = { origin: string } | { fetchSite: string };

export function crossOriginWrite(
  method: string,
  headers: { origin?: string | null; fetchSite?: string | null },
  ownOrigins: Iterable<string>,
): CrossOrigin | undefined {
  if (SAFE_METHODS.has(method.toUpperCase())) return undefined;
  const origin = headers.origin ?? null;
  if (origin !== null) return new Set(ownOrigins).has(origin) ? undefined : { origin };
  const site = headers.fetchSite ?? null;
  if (site !== null && site !== "same-origin" && site !== "none") return { fetchSite: site };
  return undefined;
}

export const CROSS_ORIGIN_MESSAGE = "Writes signed in with the session cookie must come from this site's own pages (or use an API token).";
