import { Form, Link } from "react-router";
import type { VersionJson } from "../pages.server";

/** The versions, newest first: open one, compare it with the one before, restore it. */
export function VersionList({ base, versions, current, latest, canEdit }: { base: string; versions: VersionJson[]; current: number; latest: number; canEdit: boolean }) {
  return (
    <section aria-labelledby="versions-title" className="rounded-card border border-line bg-surface p-4 text-sm">
      <div className="mb-2 flex items-baseline justify-between">
        <h2 id="versions-title" className="font-semibold">
          Versions
        </h2>
        <Link to={`${base}/versions`} className="text-xs text-accent-strong hover:underline">
          compare…
        </Link>
      </div>
      <ol className="space-y-2" data-testid="version-list">
        {versions.map((v) => (
          <li key={v.number} className={`rounded-md px-2 py-1.5 ${v.number === current ? "bg-accent-soft" : ""}`}>
            <div className="flex items-baseline justify-between gap-2">
              <Link to={v.number === latest ? base : `${base}?v=${v.number}`} className="font-medium hover:underline">
                v{v.number}
              </Link>
              <span className="text-xs text-muted">{v.createdAt.slice(0, 10)}</span>
            </div>
            <p className="text-xs text-muted">
              {v.author ?? "former member"}
              {v.changeNote ? ` — ${v.changeNote}` : ""}
            </p>
            <div className="mt-1 flex gap-3 text-xs">
              {v.number > 1 && (
                <Link to={`${base}/versions?from=${v.number - 1}&to=${v.number}`} className="text-accent-strong hover:underline">
                  changes
                </Link>
              )}
              {canEdit && v.number !== latest && (
                <Form method="post" action={base}>
                  <input type="hidden" name="intent" value="restore" />
                  <input type="hidden" name="number" value={v.number} />
                  <button type="submit" className="text-accent-strong hover:underline">
                    restore
                  </button>
                </Form>
              )}
            </div>
          </li>
        ))}
      </ol>
    </section>
  );
}
