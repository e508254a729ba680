import type { ReactNode } from "react";

/** What a sortable column header needs of a table header (structural, so any table's header fits). */
interface SortableColumnHeader {
  readonly id: string;
  readonly column: {
    readonly id: string;
    getCanSort(): boolean;
    getIsSorted(): false | "asc" | "desc";
    getToggleSortingHandler(): ((event: unknown) => void) | undefined;
  };
}

/**
 * One header cell of a sortable results table: a button that toggles the order, an arrow for the
 * current one and `aria-sort` for screen readers; a plain cell when the column does not sort.
 */
export function SortableHeader({ header, className, buttonClassName, testId, children }: {
  header: SortableColumnHeader;
  className: string;
  buttonClassName: string;
  testId?: string;
  children: ReactNode;
}) {
  const sorted = header.column.getIsSorted();
  return (
    <th className={className} aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"}>
      {header.column.getCanSort() ? (
        <button type="button" className={`inline-flex items-center gap-1 hover:text-ink ${buttonClassName}`} onClick={header.column.getToggleSortingHandler()} data-testid={testId}>
          {children}
          <span aria-hidden="true" className="w-3 text-accent">
            {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : ""}
          </span>
        </button>
      ) : (
        children
      )}
    </th>
  );
}
