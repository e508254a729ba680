import { Link } from "react-router";
import type { NetworkPageData } from "../pages.server";
import type { NetworkActionResult } from "../actions.server";
import { formatDateTime } from "~/shared/dates";

export function NetworkHeader({ data: d, result }: { data: NetworkPageData; result?: NetworkActionResult }) {
  const base = `/labs/${d.lab.slug}/networks/${d.network.id}`;
  const v = d.version.number === d.latestNumber ? "" : `?v=${d.version.number}`;
  const downloads = [
    ["network.csv", "Network (CSV)"],
    ["odes.tex", "ODEs (LaTeX)"],
    ["stoichiometric-matrix.csv", "Stoichiometric matrix (CSV)"],
    ["network.xml", "SBML (Level 3)"],
    ["network.txt", "Reaction list (text)"],
    ["odes.py", "ODEs (Python)"],
    ["odes.jl", "ODEs (Julia)"],
  ] as const;
  return (
    <header className="space-y-3">
      <p className="text-sm text-muted">
        <Link to={`/labs/${d.lab.slug}/networks`} className="hover:underline">
          {d.lab.name} · Networks
        </Link>
      </p>
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div className="space-y-1">
          <h1 className="text-2xl font-semibold tracking-tight" data-testid="network-name">
            {d.network.name}
            {d.network.archived && <span className="ml-3 rounded-pill bg-sunken px-2 py-0.5 align-middle text-xs font-normal text-muted">archived</span>}
          </h1>
          {d.network.description && <p className="max-w-prose text-sm text-muted">{d.network.description}</p>}
          {d.network.tags.length > 0 && (
            <div className="flex flex-wrap gap-1">
              {d.network.tags.map((t) => (
                <span key={t} className="rounded-pill bg-accent-soft px-2 py-0.5 text-xs text-accent-strong">
                  {t}
                </span>
              ))}
            </div>
          )}
          <p className="text-sm" data-testid="version-line">
            Version {d.version.number} of {d.latestNumber} · {d.version.author ?? (d.lab.isPublic ? "worked example" : "former member")} · {formatDateTime(d.version.createdAt)}
            {d.version.changeNote && <span className="text-muted"> — {d.version.changeNote}</span>}
          </p>
          <p className="font-mono text-xs text-faint" title="SHA-256 of the stored CSV">
            sha256 {d.version.contentHash.slice(0, 16)}…
          </p>
        </div>
        <div className="flex flex-col items-end gap-2 text-sm">
          {d.canEdit && (
            <Link to={`${base}/edit`} className="btn-primary">
              Edit as new version
            </Link>
          )}
          <div className="flex flex-wrap justify-end gap-1" aria-label="Downloads">
            {downloads.map(([file, label]) => (
              <a key={file} href={`${base}/download/${file}${v}`} className="btn-quiet px-2.5 py-1 text-xs" download>
                ↓ {label}
              </a>
            ))}
          </div>
        </div>
      </div>
      {d.version.number !== d.latestNumber && (
        <p className="rounded-md bg-signal-soft px-4 py-2 text-sm text-signal">
          You are looking at an older version. <Link to={base} className="underline">Go to the newest (version {d.latestNumber})</Link>.
        </p>
      )}
      {result?.error && (
        <p role="alert" className="rounded-md bg-danger-soft px-3 py-2 text-sm text-danger">
          {result.error}
        </p>
      )}
      {result?.notice && (
        <p role="status" className="rounded-md bg-ok-soft px-3 py-2 text-sm text-ok">
          {result.notice}
        </p>
      )}
    </header>
  );
}
