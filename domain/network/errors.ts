/** One located problem in a network file. */
export interface NetworkFileProblem {
  /** 1-based line number in the file (the header is usually line 1). */
  readonly row: number;
  /** Header name of the column, when the problem belongs to one cell. */
  readonly column?: string;
  /** 1-based column index, when known. */
  readonly columnIndex?: number;
  readonly message: string;
  /** What would have been accepted, e.g. "a positive decimal such as 0.5 or a fraction such as 3/2". */
  readonly expected?: string;
}

/** Formats a problem for people. Example: `line 3, column 2 (rate): bad rate symbol `1k`; expected …`. */
export function formatProblem(p: NetworkFileProblem): string {
  const where = [`line ${p.row}`];
  if (p.columnIndex !== undefined || p.column !== undefined) {
    where.push(
      p.columnIndex !== undefined
        ? `column ${p.columnIndex}${p.column !== undefined ? ` (${p.column})` : ""}`
        : `column ${p.column}`,
    );
  }
  return `${where.join(", ")}: ${p.message}${p.expected ? `; expected ${p.expected}` : ""}`;
}

/**
 * Every problem found in a network file, in file order. Thrown by parseNetworkCsv only after the
 * whole file has been read, so one report lists all problems.
 */
export class NetworkFileError extends Error {
  readonly problems: readonly NetworkFileProblem[];
  constructor(problems: readonly NetworkFileProblem[]) {
    const sorted = [...problems].sort((a, b) => a.row - b.row || (a.columnIndex ?? 0) - (b.columnIndex ?? 0));
    super(
      `The network file has ${sorted.length} problem${sorted.length === 1 ? "" : "s"}:\n` +
        sorted.map((p) => `  ${formatProblem(p)}`).join("\n"),
    );
    this.name = "NetworkFileError";
    this.problems = sorted;
  }
}
