import type { ServerLoadContext } from "~/load-context";

/**
 * Who is asking, for per-client rate limits: the client address the production server puts in
 * the load context (scripts/serve.ts; behind a reverse proxy, TRUST_PROXY says how many hops of
 * X-Forwarded-For to believe, so a client cannot choose its own bucket). Without an address
 * (e.g. under `react-router dev`) all clients share one conservative bucket.
 *
 *   clientKey({ clientAddress: "127.0.0.2" }) // "ip:127.0.0.2"
 *   clientKey({})                             // "direct"
 */
export function clientKey(context: ServerLoadContext | undefined): string {
  const address = context?.clientAddress?.trim();
  return address ? `ip:${address.slice(0, 64)}` : "direct";
}
