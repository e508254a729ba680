/**
 * Who is asking, for per-client rate limits. React Router's request carries no socket address,
 * so behind the HTTPS reverse proxy we use the address it appends last to X-Forwarded-For (the
 * entries before it are client-supplied and could be forged). Direct connections, as in local
 * use on loopback, share one bucket — conservative: the per-address limit still applies.
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
