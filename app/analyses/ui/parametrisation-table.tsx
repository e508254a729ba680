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
  tableFeatures,
  useTable,
  type FilterFn,
} from "@tanstack/react-table";
import type { ParametrisationRow } from "~/analyses/present";
import { Tex } from "./tex";
import { SortableHeader } from "./sortable-header";

const dependsOnIncludes: FilterFn<any, ParametrisationRow> = (row, _id, value: string) => {
  const needle = value.trim();
  return (row.original.dependsOn ?? []).some((n) => n === needle || n.toLowerCase().includes(needle.toLowerCase()));
};
dependsOnIncludes.autoRemove = (v) => typeof v !== "string" || v.trim() === "";

const features = tableFeatures({
  rowSortingFeature,
  columnFilteringFeature,
  sortedRowModel: createSortedRowModel(),
  filteredRowModel: createFilteredRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic },
  filterFns: { includesString: filterFn_includesString, equals: filterFn_equals, dependsOnIncludes },
});
const column = createColumnHelper<typeof features, ParametrisationRow>();
const columns = column.columns([
  column.accessor("species", { header: "Species", sortFn: "alphanumeric", filterFn: "includesString", cell: (i) => <span className="font-mono">{i.getValue()}</span> }),
  column.accessor("expression", {
    header: "Expression",
    sortFn: "alphanumeric",
    enableSorting: false,
    cell: (i) => (
      <div className="space-y-1">
        {i.row.original.tex !== null && <Tex tex={i.row.original.tex} />}
        <div className={`font-mono ${i.row.original.tex !== null ? "text-xs text-muted" : "text-sm"}`} data-testid="expression-text">
          {i.getValue()}
        </div>
      </div>
    ),
  }),
  column.accessor((r) => (r.dependsOn ? r.dependsOn.join(", ") : "not recorded"), { id: "dependsOn", header: "Depends on", filterFn: "dependsOnIncludes", sortFn: "alphanumeric", cell: (i) => <span className="font-mono text-xs">{i.getValue()}</span> }),
  column.accessor((r) => r.degree ?? -1, {
    id: "degree",
    header: "Degree",
    sortFn: "basic",
    cell: (i) => (i.row.original.degree === null ? <span className="text-muted" title="not recorded by the engine version that made this result">—</span> : <span className="tabular-nums">{i.row.original.degree}</span>),
  }),
  column.accessor((r) => (r.positive === null ? "not recorded" : r.positive ? "yes" : "no"), { id: "positive", header: "Positive", sortFn: "alphanumeric", filterFn: "equals" }),
]);

/** The parametrisation, one row per dependent species; sortable by every column but the formula, filterable. */
export function ParametrisationTable({ rows }: { rows: ParametrisationRow[] }) {
  const table = useTable({ features, columns, data: rows });
  const visible = table.getRowModel().rows;
  const field = "rounded-md border border-line bg-surface px-2 py-1";
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-end gap-3 text-sm" role="search">
        <label className="space-y-0.5">
          <span className="block text-xs font-medium">Species contains</span>
          <input className={field} onChange={(e) => table.getColumn("species")?.setFilterValue(e.target.value)} />
        </label>
        <label className="space-y-0.5">
          <span className="block text-xs font-medium">Depends on</span>
          <input className={field} placeholder="e.g. k1" onChange={(e) => table.getColumn("dependsOn")?.setFilterValue(e.target.value)} />
        </label>
        <label className="space-y-0.5">
          <span className="block text-xs font-medium">Positive</span>
          <select className={field} onChange={(e) => table.getColumn("positive")?.setFilterValue(e.target.value === "" ? undefined : e.target.value)}>
            <option value="">any</option>
            <option value="yes">yes</option>
            <option value="no">no</option>
          </select>
        </label>
        <p className="ml-auto text-muted" aria-live="polite">
          {visible.length} of {rows.length}
        </p>
      </div>
      <div className="overflow-x-auto rounded-card border border-line bg-surface">
        <table className="w-full text-left text-sm" data-testid="parametrisation-table">
          <thead className="border-b border-line bg-sunken text-xs uppercase tracking-wide text-muted">
            {table.getHeaderGroups().map((g) => (
              <tr key={g.id}>
                {g.headers.map((h) => (
                  <SortableHeader key={h.id} header={h} className="px-3 py-2 font-medium" buttonClassName="uppercase">
                    <table.FlexRender header={h} />
                  </SortableHeader>
                ))}
              </tr>
            ))}
          </thead>
          <tbody>
            {visible.map((row) => (
              <tr key={row.id} className="border-b border-line align-top last:border-0" data-testid="parametrisation-row">
                {row.getAllCells().map((cell) => (
                  <td key={cell.id} className="px-3 py-2 [&_.katex]:whitespace-nowrap">
                    <table.FlexRender cell={cell} />
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
