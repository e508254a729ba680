import { Form, Link } from "react-router";
import type { VersionJson } from "../pages.server";
import { formatDateTime } from "~/shared/dates";

const SHOWN = 5;

/** The newest versions: open one, see what it changed, restore it as a new version. */
export function VersionList({ base, versions, current, latest, canEdit, unknownAuthor = "former member" }: { base: string; versions: VersionJson[]; current: number; latest: number; canEdit: boolean; unknownAuthor?: string }) {
  return (
    <section aria-labelledby="versions-title" className="rounded-card border border-line bg-surface px-4 py-3 text-sm">
      <div className="mb-1 flex items-baseline justify-between">
        <h2 id="versions-title" className="font-semibold">
          Versions <span className="font-normal text-muted">({versions.length})</span>
        </h2>
        <Link to={`${base}/versions`} className="text-accent-strong hover:underline">
          {versions.length > SHOWN ? `all ${versions.length} versions and comparisons` : "compare versions"}
        </Link>
      </div>
      <div className="relative overflow-x-auto">
        <table className="w-full" data-testid="version-list">
          <tbody>
            {versions.slice(0, SHOWN).map((v) => (
              <tr key={v.number} className={`border-t border-line ${v.number === current ? "bg-accent-soft" : ""}`}>
                <td className="py-1 pl-2 pr-3">
                  <Link to={v.number === latest ? base : `${base}?v=${v.number}`} className="font-medium hover:underline">
                    v{v.number}
                  </Link>
                  {v.number === current && <span className="sr-only"> (shown)</span>}
                </td>
                <td className="whitespace-nowrap py-1 pr-3 text-muted">{formatDateTime(v.createdAt)}</td>
                <td className="whitespace-nowrap py-1 pr-3 text-muted">{v.author ?? unknownAuthor}</td>
                <td className="w-full py-1 pr-3">{v.changeNote}</td>
                <td className="whitespace-nowrap py-1 pr-2 text-right">
                  {v.number > 1 && (
                    <Link to={`${base}/versions?from=${v.number - 1}&to=${v.number}`} className="text-accent-strong hover:underline">
                      changes
                    </Link>
                  )}
                  {canEdit && v.number !== latest && (
                    <Form method="post" action={base} className="ml-3 inline">
                      <input type="hidden" name="intent" value="restore" />
                      <input type="hidden" name="number" value={v.number} />
                      <button type="submit" className="text-accent-strong hover:underline" aria-label={`Restore version ${v.number} as a new version`}>
                        restore
                      </button>
                    </Form>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
