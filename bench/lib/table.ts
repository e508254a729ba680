/**
 * Plain-text rendering of the benchmark table: times, ratios with bounds for timed-out runs,
 * and column alignment.
 *
 * Example: formatTiming({ status: "timeout" }, 120) is ">120 s"; formatRatio(ratioOf(ok(2), ok(8), 120))
 * is "0.25"; a ratio against a timed-out reference is an upper bound such as "<0.017".
 */
export type ToolSummary =
  | {
      readonly status: "ok";
      /** Median wall-clock seconds of `runs`. */
      readonly median: number;
      readonly runs: readonly number[];
      /** CPU seconds (user + system) per run and their median, when GNU time measured them. */
      readonly cpuRuns?: readonly number[];
      readonly cpuMedian?: number;
      /** Largest peak resident memory over the runs, in kilobytes. */
      readonly maxRssKb?: number;
    }
  | { readonly status: "timeout" }
  | { readonly status: "error"; readonly message: string }
  | { readonly status: "n/a"; readonly reason: string };

/** A ratio, or a bound on it when one side hit the timeout: "<" means at most, ">" at least. */
export type Ratio = { readonly bound: "=" | "<" | ">"; readonly value: number } | undefined;

export function formatNumber(x: number): string {
  if (x === 0) return "0";
  if (x >= 100) return x.toFixed(0);
  if (x >= 10) return x.toFixed(1);
  if (x >= 1) return x.toFixed(2);
  return x.toPrecision(2);
}

export function formatTiming(t: ToolSummary, timeoutSeconds: number): string {
  switch (t.status) {
    case "ok":
      return `${formatNumber(t.median)} s`;
    case "timeout":
      return `>${timeoutSeconds} s`;
    case "error":
      return "error";
    case "n/a":
      return "n/a";
  }
}

/** ours / reference, using the timeout as the bound for a side that timed out. */
export function ratioOf(ours: ToolSummary, reference: ToolSummary, timeoutSeconds: number): Ratio {
  // A zero reference (below the clock's resolution) gives no meaningful ratio.
  if (ours.status === "ok" && reference.status === "ok") return reference.median > 0 ? { bound: "=", value: ours.median / reference.median } : undefined;
  if (ours.status === "ok" && reference.status === "timeout") return { bound: "<", value: ours.median / timeoutSeconds };
  if (ours.status === "timeout" && reference.status === "ok") return { bound: ">", value: timeoutSeconds / reference.median };
  return undefined;
}

export function formatRatio(r: Ratio): string {
  if (!r) return "–";
  return `${r.bound === "=" ? "" : r.bound}${formatNumber(r.value)}`;
}

/** Columns padded to their widest cell; `right` marks right-aligned columns. */
export function renderTable(headers: readonly string[], rows: readonly (readonly string[])[], right: readonly boolean[]): string {
  const widths = headers.map((h, c) => Math.max([...h].length, ...rows.map((r) => [...(r[c] ?? "")].length)));
  const pad = (cell: string, c: number) => {
    const fill = " ".repeat(widths[c] - [...cell].length);
    return right[c] ? fill + cell : cell + fill;
  };
  const line = (cells: readonly string[]) => cells.map((cell, c) => pad(cell, c)).join("  ").trimEnd();
  return [line(headers), widths.map((w) => "-".repeat(w)).join("  "), ...rows.map(line)].join("\n");
}

/**
 * The same summary with CPU time in place of wall time (n/a when CPU time was not measured),
 * so ratioOf and formatTiming work on CPU seconds too.
 */
export function cpuView(t: ToolSummary): ToolSummary {
  if (t.status !== "ok") return t;
  if (t.cpuMedian === undefined || !t.cpuRuns) return { status: "n/a", reason: "CPU time not measured" };
  return { status: "ok", median: t.cpuMedian, runs: t.cpuRuns };
}
