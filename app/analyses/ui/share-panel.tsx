import { useFetcher } from "react-router";

export interface ShareLinkJson {
  id: string;
  createdAt: string;
  expiresAt: string;
  creator: string | null;
  state: "active" | "expired" | "revoked";
}

/** Owners make read-only links for people outside the lab; the token is shown once, right after creation. */
export function SharePanel({ links, created }: { links: ShareLinkJson[]; created?: { url: string; expiresAt: string } }) {
  const create = useFetcher<{ shareLink?: { url: string; expiresAt: string } }>();
  const revoke = useFetcher();
  const fresh = create.data?.shareLink ?? created;
  return (
    <div className="space-y-3">
      <create.Form method="post" className="flex flex-wrap items-end gap-3 text-sm">
        <input type="hidden" name="intent" value="share-create" />
        <label className="space-y-0.5">
          <span className="block">Expires after (days)</span>
          <input name="days" type="number" min={1} max={90} defaultValue={14} className="w-20 rounded-md border border-line bg-surface px-2 py-1" />
        </label>
        <button type="submit" className="rounded-md border border-accent px-3 py-1.5 font-medium text-accent-strong hover:bg-accent-soft">
          Create read-only link
        </button>
      </create.Form>
      {fresh && (
        <p className="rounded-md bg-accent-soft px-3 py-2 text-sm" role="status">
          Copy this link now; it is not shown again (expires {fresh.expiresAt.slice(0, 10)}):{" "}
          <a href={fresh.url} className="break-all font-mono text-accent-strong" data-testid="share-url">
            {fresh.url}
          </a>
        </p>
      )}
      {links.length > 0 && (
        <ul className="space-y-1 text-sm">
          {links.map((l) => (
            <li key={l.id} className="flex items-center gap-3">
              <span className={l.state === "active" ? "text-ok" : "text-muted"}>{l.state}</span>
              <span className="text-muted">
                made {l.createdAt.slice(0, 10)} by {l.creator ?? "former member"}, expires {l.expiresAt.slice(0, 10)}
              </span>
              {l.state === "active" && (
                <revoke.Form method="post">
                  <input type="hidden" name="intent" value="share-revoke" />
                  <input type="hidden" name="linkId" value={l.id} />
                  <button className="text-danger hover:underline">Revoke</button>
                </revoke.Form>
              )}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
