import { csvTable } from "~/downloads/escape";

/**
 * The data a chart draws, as a table: the CSV export of every plot is this table, so the file
 * holds exactly the plotted rows (one row per drawn point), headed by the axis names.
 */
export interface PlotTable {
  columns: string[];
  rows: Record<string, string | number | null>[];
}

/** The table as CSV with a header row (cells made safe for spreadsheets). */
export function plotCsv(table: PlotTable): string {
  return csvTable(table.columns, table.rows);
}

/** A file name part from user-chosen names: letters, digits, `.`, `_` and `-` only. */
export function fileStem(...parts: string[]): string {
  return parts.map((p) => p.replace(/[^A-Za-z0-9._-]+/g, "_")).join("-");
}
