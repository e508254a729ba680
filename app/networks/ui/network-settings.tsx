import { Form } from "react-router";
import type { NetworkJson } from "../pages.server";
import type { NetworkActionResult } from "../actions.server";

const inputCls = "w-full rounded-md border border-line bg-surface px-3 py-2 text-sm focus:border-accent focus:outline-none";

/** Rename, describe, tag, archive (editors); delete with confirmation (owners). */
export function NetworkSettings({ network, canDelete, result }: { network: NetworkJson; canDelete: boolean; result?: NetworkActionResult }) {
  return (
    <section aria-labelledby="settings-title" className="space-y-4 border-t border-line pt-6">
      <h2 id="settings-title" className="text-lg font-semibold">
        Details
      </h2>
      <Form method="post" className="grid grid-cols-1 max-w-3xl gap-3 md:grid-cols-2" key={network.updatedAt}>
        <input type="hidden" name="intent" value="details" />
        <label className="space-y-1 text-sm font-medium">
          Name
          <input name="name" defaultValue={network.name} required maxLength={200} className={inputCls} />
          {result?.fields?.name && <span className="text-xs text-danger">{result.fields.name}</span>}
        </label>
        <label className="space-y-1 text-sm font-medium">
          Tags <span className="font-normal text-muted">(comma-separated)</span>
          <input name="tags" defaultValue={network.tags.join(", ")} className={inputCls} />
          {result?.fields?.tags && <span className="text-xs text-danger">{result.fields.tags}</span>}
        </label>
        <label className="space-y-1 text-sm font-medium md:col-span-2">
          Description
          <textarea name="description" defaultValue={network.description} rows={3} className={inputCls} />
        </label>
        <div>
          <button type="submit" className="btn-quiet">
            Save details
          </button>
        </div>
      </Form>
      <div className="flex flex-wrap gap-6 text-sm">
        <Form method="post">
          <input type="hidden" name="intent" value={network.archived ? "unarchive" : "archive"} />
          <button type="submit" className="btn-quiet">
            {network.archived ? "Bring back from the archive" : "Archive"}
          </button>
        </Form>
        {canDelete && (
          <details className="rounded-md border border-danger/40 px-3 py-2">
            <summary className="cursor-pointer text-danger">Delete this network…</summary>
            <Form method="post" className="mt-2 space-y-2">
              <input type="hidden" name="intent" value="delete" />
              <p className="max-w-md text-muted">Deleting removes every version and every analysis of this network for good. Type its name to confirm.</p>
              <input name="confirmName" className={inputCls} placeholder={network.name} aria-label="Network name to confirm" />
              <button type="submit" className="btn bg-danger text-accent-ink hover:opacity-90">
                Delete for good
              </button>
            </Form>
          </details>
        )}
      </div>
    </section>
  );
}
