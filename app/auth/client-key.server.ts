/**
 * Who is asking, for per-client rate limits. React Router's Request carries no socket address,
 * so the production server (scripts/serve.ts) writes it into X-Forwarded-For, replacing whatever
 * the client sent; with TRUST_PROXY=1 it keeps the header of the reverse proxy in front, whose
 * own appended entry is the last one (earlier entries are client-supplied and could be forged).
 * Without the header (e.g. under `react-router dev`) all clients share one conservative bucket.
 */
export function clientKey(request: Request): string {
  const forwarded = request.headers.get("x-forwarded-for");
  if (forwarded) {
    const hops = forwarded.split(",").map((h) => h.trim()).filter(Boolean);
    const last = hops[hops.length - 1];
    if (last) return `ip:${last.slice(0, 64)}`;
  }
  return "direct";
}
