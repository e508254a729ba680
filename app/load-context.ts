/**
 * What the production server (scripts/serve.ts) hands every loader and action besides the
 * Request, which carries no socket address. Under `react-router dev` and in tests that call a
 * loader directly the context is empty, and every field here is then undefined.
 */
export interface ServerLoadContext {
  /**
   * The connecting client's address, after the `TRUST_PROXY` setting has been applied to
   * X-Forwarded-For (express's `req.ip`), with the IPv4-mapped IPv6 prefix removed.
   */
  clientAddress?: string;
}

declare module "react-router" {
  // Declaration merging: React Router types `context` as AppLoadContext.
  // eslint-disable-next-line @typescript-eslint/no-empty-object-type
  interface AppLoadContext extends ServerLoadContext {}
}
