import { useState } from "react";
import { Link } from "react-router";
import {
  columnFilteringFeature,
  createColumnHelper,
  createFilteredRowModel,
  createSortedRowModel,
  filterFn_equals,
  filterFn_includesString,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  sortFn_datetime,
  tableFeatures,
  useTable,
  type FilterFn,
} from "@tanstack/react-table";
import { formatDateTime } from "~/shared/dates";

/** One line of the lab's network list (plain JSON from the loader). */
export interface NetworkTableRow {
  id: string;
  name: string;
  href: string;
  tags: string[];
  archived: boolean;
  species: string[];
  speciesCount: number;
  reactionCount: number;
  /** Null while the worker computes the structure. */
  deficiency: number | null;
  lastChange: string;
  author: string;
  version: number;
}

/** Matches when any species name contains the typed text (case-insensitive). */
const speciesIncludes: FilterFn<any, NetworkTableRow> = (row, _columnId, value: string) => {
  const needle = value.trim().toLowerCase();
  return row.original.species.some((s) => s.toLowerCase().includes(needle));
};
speciesIncludes.autoRemove = (v) => typeof v !== "string" || v.trim() === "";

const features = tableFeatures({
  rowSortingFeature,
  columnFilteringFeature,
  sortedRowModel: createSortedRowModel(),
  filteredRowModel: createFilteredRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic, datetime: sortFn_datetime },
  filterFns: { includesString: filterFn_includesString, equals: filterFn_equals, speciesIncludes },
});

const column = createColumnHelper<typeof features, NetworkTableRow>();

const columns = column.columns([
  column.accessor("name", {
    header: "Name",
    sortFn: "alphanumeric",
    filterFn: "includesString",
    cell: (info) => (
      <div>
        <Link to={info.row.original.href} className="font-medium text-accent-strong hover:underline">
          {info.getValue()}
        </Link>
        {info.row.original.archived && <span className="ml-2 rounded-pill bg-sunken px-2 py-0.5 text-xs text-muted">archived</span>}
        {info.row.original.tags.length > 0 && (
          <div className="mt-1 flex flex-wrap gap-1">
            {info.row.original.tags.map((t) => (
              <span key={t} className="rounded-pill bg-accent-soft px-2 py-0.5 text-xs text-accent-strong">
                {t}
              </span>
            ))}
          </div>
        )}
      </div>
    ),
  }),
  column.accessor("speciesCount", {
    id: "species",
    header: "Species",
    sortFn: "basic",
    filterFn: "speciesIncludes",
    cell: (info) => (
      <span title={info.row.original.species.join(", ")} className="tabular-nums">
        {info.getValue()}
      </span>
    ),
  }),
  column.accessor("reactionCount", { header: "Reactions", sortFn: "basic", cell: (info) => <span className="tabular-nums">{info.getValue()}</span> }),
  column.accessor("deficiency", {
    header: "Deficiency",
    sortFn: "basic",
    filterFn: "equals",
    cell: (info) => {
      const value = info.getValue();
      return value === null ? <span className="text-muted" title="Being computed in the background">…</span> : <span className="tabular-nums">{value}</span>;
    },
  }),
  column.accessor("lastChange", {
    header: "Last change",
    sortFn: "alphanumeric",
    cell: (info) => (
      <span className="whitespace-nowrap text-muted">
        {formatDateTime(info.getValue())} · v{info.row.original.version}
      </span>
    ),
  }),
  column.accessor("author", { header: "Author", sortFn: "alphanumeric", filterFn: "includesString" }),
]);

export function NetworkTable({ rows }: { rows: NetworkTableRow[] }) {
  const table = useTable({ features, columns, data: rows, initialState: { sorting: [{ id: "lastChange", desc: true }] } });
  const deficiencies = [...new Set(rows.map((r) => r.deficiency).filter((d): d is number => d !== null))].sort((a, b) => a - b);
  const [deficiency, setDeficiency] = useState("");
  const visible = table.getRowModel().rows;
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3 text-sm" role="search">
        <label className="space-y-1">
          <span className="block font-medium">Name contains</span>
          <input
            className="w-56 rounded-md border border-line bg-surface px-3 py-1.5"
            placeholder="e.g. kinase"
            onChange={(e) => table.getColumn("name")?.setFilterValue(e.target.value)}
          />
        </label>
        <label className="space-y-1">
          <span className="block font-medium">Has a species named</span>
          <input
            className="w-48 rounded-md border border-line bg-surface px-3 py-1.5"
            placeholder="e.g. ATP"
            onChange={(e) => table.getColumn("species")?.setFilterValue(e.target.value)}
          />
        </label>
        <label className="space-y-1">
          <span className="block font-medium">Deficiency</span>
          <select
            className="rounded-md border border-line bg-surface px-3 py-1.5"
            value={deficiency}
            onChange={(e) => {
              setDeficiency(e.target.value);
              table.getColumn("deficiency")?.setFilterValue(e.target.value === "" ? undefined : Number(e.target.value));
            }}
          >
            <option value="">any</option>
            {deficiencies.map((d) => (
              <option key={d} value={d}>
                {d}
              </option>
            ))}
          </select>
        </label>
        <p className="ml-auto text-muted" aria-live="polite">
          {visible.length} of {rows.length} network{rows.length === 1 ? "" : "s"}
        </p>
      </div>
      <div className="overflow-x-auto rounded-card border border-line bg-surface">
        <table className="w-full text-left text-sm" data-testid="network-table">
          <thead className="border-b border-line bg-sunken text-xs uppercase tracking-wide text-muted">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  return (
                    <th key={header.id} className="px-4 py-2 font-medium" aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"}>
                      <button type="button" className="inline-flex items-center gap-1 uppercase hover:text-ink" onClick={header.column.getToggleSortingHandler()}>
                        <table.FlexRender header={header} />
                        <span aria-hidden="true" className="w-3 text-accent">
                          {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : ""}
                        </span>
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {visible.map((row) => (
              <tr key={row.id} className="border-b border-line last:border-0 hover:bg-paper" data-testid="network-row">
                {row.getAllCells().map((cell) => (
                  <td key={cell.id} className="px-4 py-2 align-top">
                    <table.FlexRender cell={cell} />
                  </td>
                ))}
              </tr>
            ))}
            {visible.length === 0 && (
              <tr>
                <td colSpan={6} className="px-4 py-6 text-center text-muted">
                  No network matches these filters.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
    </div>
  );
}
