import { Form, Link, useSearchParams } from "react-router";
import type { JobJson } from "~/analyses/repository.server";
import { analysesPath, analysisPath } from "~/analyses/paths";
import { networkPath } from "~/networks/paths";
import { StatusBadge } from "./status";
import { formatDateTime } from "~/shared/dates";

type Run = JobJson & { partial: boolean };
interface Choices {
  networks: { id: string; name: string }[];
  authors: { id: string; name: string }[];
  kinds: readonly { value: string; label: string }[];
  statuses: readonly string[];
}

const COLUMNS = [
  { key: "name", label: "Run" },
  { key: "network", label: "Network" },
  { key: "version", label: "Version" },
  { key: "status", label: "Status" },
  { key: "date", label: "Started" },
  { key: "author", label: "By" },
] as const;

const kindOf = (p: { rateMode?: string; initial?: unknown }) => (p.rateMode === "symbolic" ? "symbolic" : p.initial ? "class" : "numeric");

/** A column header that sorts by its key; a second click reverses the order. */
function SortHeader({ k, label }: { k: string; label: string }) {
  const [params] = useSearchParams();
  const current = params.get("sort") ?? "date";
  const dir = params.get("dir") ?? "desc";
  const next = new URLSearchParams(params);
  next.set("sort", k);
  next.set("dir", current === k && dir === "asc" ? "desc" : "asc");
  const sorted = current === k;
  return (
    <th className="px-3 py-2" aria-sort={sorted ? (dir === "asc" ? "ascending" : "descending") : "none"}>
      <Link to={`?${next}`} className="hover:text-ink" data-testid={`sort-${k}`}>
        {label}
        {sorted ? (dir === "asc" ? " ▲" : " ▼") : ""}
      </Link>
    </th>
  );
}

function Select({ name, label, options, value }: { name: string; label: string; options: { value: string; label: string }[]; value: string }) {
  return (
    <label className="space-y-0.5">
      <span className="block text-xs text-muted">{label}</span>
      <select name={name} defaultValue={value} className="rounded-md border border-line bg-surface px-2 py-1">
        <option value="">any</option>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </label>
  );
}

/** Filters (a GET form, so a filtered list is a link), the sortable table, and "compare selected". */
export function RunsList({ labSlug, runs, choices, kindLabels }: { labSlug: string; runs: Run[]; choices: Choices; kindLabels: Record<string, string> }) {
  const [params] = useSearchParams();
  const v = (k: string) => params.get(k) ?? "";
  const archived = v("archived") === "1";
  return (
    <div className="space-y-3">
      <Form method="get" className="flex flex-wrap items-end gap-3 text-sm" data-testid="run-filters">
        <Select name="network" label="Network" value={v("network")} options={choices.networks.map((n) => ({ value: n.id, label: n.name }))} />
        <label className="space-y-0.5">
          <span className="block text-xs text-muted">Version</span>
          <input name="version" type="number" min={1} defaultValue={v("version")} className="w-20 rounded-md border border-line bg-surface px-2 py-1" />
        </label>
        <Select name="kind" label="Kind" value={v("kind")} options={choices.kinds.map((k) => ({ value: k.value, label: k.label }))} />
        <Select name="status" label="Status" value={v("status")} options={choices.statuses.map((s) => ({ value: s, label: s }))} />
        <Select name="author" label="Started by" value={v("author")} options={choices.authors.map((a) => ({ value: a.id, label: a.name }))} />
        <label className="space-y-0.5">
          <span className="block text-xs text-muted">From</span>
          <input name="from" type="date" defaultValue={v("from")} className="rounded-md border border-line bg-surface px-2 py-1" />
        </label>
        <label className="space-y-0.5">
          <span className="block text-xs text-muted">To</span>
          <input name="to" type="date" defaultValue={v("to")} className="rounded-md border border-line bg-surface px-2 py-1" />
        </label>
        <label className="flex items-center gap-1.5 pb-1">
          <input type="checkbox" name="archived" value="1" defaultChecked={archived} /> Show archived
        </label>
        {params.get("sort") && <input type="hidden" name="sort" value={v("sort")} />}
        {params.get("dir") && <input type="hidden" name="dir" value={v("dir")} />}
        <button className="rounded-md border border-accent px-3 py-1 font-medium text-accent-strong hover:bg-accent-soft">Filter</button>
        <Link to={analysesPath(labSlug)} className="pb-1 text-muted hover:text-ink">
          Clear
        </Link>
      </Form>
      <Form method="get" action={`${analysesPath(labSlug)}/compare`} className="space-y-2">
        <div className="overflow-x-auto rounded-card border border-line bg-surface">
          <table className="w-full text-left text-sm" data-testid="analyses-table">
            <thead className="border-b border-line bg-sunken text-xs uppercase tracking-wide text-muted">
              <tr>
                <th className="px-3 py-2">
                  <span className="sr-only">Compare</span>
                </th>
                {COLUMNS.map((c) => (
                  <SortHeader key={c.key} k={c.key} label={c.label} />
                ))}
              </tr>
            </thead>
            <tbody>
              {runs.map((a) => (
                <tr key={a.id} className="border-b border-line align-top last:border-0" data-testid="analysis-row">
                  <td className="px-3 py-2">
                    <input type="checkbox" name="id" value={a.id} aria-label={`compare ${a.name || a.network.name}`} disabled={a.status !== "succeeded"} />
                  </td>
                  <td className="px-3 py-2">
                    <Link to={analysisPath(labSlug, a.id)} className="font-medium text-accent-strong hover:underline" data-testid="run-name">
                      {a.name || <span className="italic">unnamed</span>}
                    </Link>
                    {a.archived && <span className="ml-2 rounded-pill bg-sunken px-2 text-xs text-muted">archived</span>}
                    <div className="text-xs text-muted">{kindLabels[kindOf(a.params as never)]}</div>
                    {a.note && <div className="max-w-xs truncate text-xs text-muted" title={a.note}>{a.note}</div>}
                  </td>
                  <td className="px-3 py-2">
                    <Link to={networkPath(labSlug, a.network.id)} className="hover:underline">
                      {a.network.name}
                    </Link>
                  </td>
                  <td className="px-3 py-2 tabular-nums">v{a.network.version}</td>
                  <td className="px-3 py-2">
                    <StatusBadge status={a.status} />
                    {a.partial && <span className="ml-1 text-xs text-signal">partial result</span>}
                  </td>
                  <td className="whitespace-nowrap px-3 py-2 text-muted">{formatDateTime(a.createdAt)}</td>
                  <td className="px-3 py-2 text-muted">{a.startedBy ?? "former member"}</td>
                </tr>
              ))}
              {runs.length === 0 && (
                <tr>
                  <td colSpan={7} className="px-4 py-6 text-center text-muted">
                    {params.toString() ? "No analysis matches these filters." : "No analyses yet. Open a network and choose “Start analysis”."}
                  </td>
                </tr>
              )}
            </tbody>
          </table>
        </div>
        {runs.length > 1 && (
          <button className="rounded-md border border-line px-3 py-1 text-sm hover:bg-sunken" data-testid="compare-selected">
            Compare selected (finished runs of one network)
          </button>
        )}
      </Form>
    </div>
  );
}
