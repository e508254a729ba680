import { useMemo } from "react";
import { createColumnHelper, createSortedRowModel, rowSortingFeature, sortFn_alphanumeric, sortFn_basic, tableFeatures, useTable } from "@tanstack/react-table";
import type { ResultView } from "~/analyses/present";
import { SortableHeader } from "./sortable-header";

type State = NonNullable<ResultView["steadyStates"]>[number];

const features = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic },
});
const column = createColumnHelper<typeof features, State>();

const verdictClass = (v: string) => (v === "stable" ? "text-ok" : v === "unstable" ? "text-danger" : "text-muted");

/** The class's positive steady states; sortable by number, by each concentration (as numbers) and by stability. */
export function SteadyStatesTable({ states, species }: { states: State[]; species: string[] }) {
  const columns = useMemo(
    () =>
      column.columns([
        column.accessor("index", { header: "#", sortFn: "basic", cell: (i) => <span className="tabular-nums">{i.getValue()}</span> }),
        ...species.map((sp) =>
          column.accessor((r) => r.concentrations[sp] ?? Number.NaN, {
            id: `conc-${sp}`,
            header: sp,
            sortFn: "basic",
            cell: (i) => (
              <span className="tabular-nums" data-testid={`conc-${sp}`}>
                {i.row.original.concentrations[sp]?.toPrecision(12)}
              </span>
            ),
          }),
        ),
        column.accessor("verdict", { header: "Stability", sortFn: "alphanumeric", cell: (i) => <span className={`font-medium ${verdictClass(i.getValue())}`}>{i.getValue()}</span> }),
        column.accessor((r) => r.eigenvalues.join(", "), { id: "eigenvalues", header: "Eigenvalues", enableSorting: false, cell: (i) => <span className="font-mono text-xs">{i.getValue() || "(none)"}</span> }),
      ]),
    [species],
  );
  const table = useTable({ features, columns, data: states });
  return (
    <div className="overflow-x-auto rounded-card border border-line bg-surface">
      <table className="w-full text-left text-sm" data-testid="steady-states">
        <thead className="border-b border-line bg-sunken text-xs uppercase tracking-wide text-muted">
          {table.getHeaderGroups().map((g) => (
            <tr key={g.id}>
              {g.headers.map((h) => {
                // Species names keep their case (they are identifiers, not labels).
                const isSpecies = h.column.id.startsWith("conc-");
                return (
                  <SortableHeader key={h.id} header={h} className={`px-3 py-2 ${isSpecies ? "font-mono normal-case" : ""}`} buttonClassName={isSpecies ? "" : "uppercase"} testId={`sort-${h.column.id}`}>
                    <table.FlexRender header={h} />
                  </SortableHeader>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="border-b border-line last:border-0" data-testid="steady-state-row">
              {row.getAllCells().map((cell) => (
                <td key={cell.id} className="px-3 py-2">
                  <table.FlexRender cell={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
