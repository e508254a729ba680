/**
 * The two tables `npm run bench` prints: wall-clock medians with ratios and the basis check,
 * then CPU-time medians (steadier on a shared machine) with ratios and peak memory.
 */
import type { SystemResult } from "./measure";
import { cpuView, formatNumber, formatRatio, formatTiming, ratioOf, renderTable, type ToolSummary } from "./table";
import type { ToolId } from "./tools";

const NA: ToolSummary = { status: "n/a", reason: "not run" };

function timeCell(t: ToolSummary | undefined, repeat: number, timeout: number): string {
  if (!t) return "–";
  const runs = t.status === "ok" && t.runs.length !== repeat ? ` (${t.runs.length}×)` : "";
  return formatTiming(t, timeout) + runs;
}

export function wallTable(results: readonly SystemResult[], repeat: number, timeout: number): string {
  const sizes = (r: SystemResult) => [...new Set(Object.values(r.agreement.basisSizes))].join("/") || "–";
  // "refs same" when our output was missing, so only the references could be compared.
  const check = (r: SystemResult) =>
    r.agreement.status === "agree" && r.agreement.basisSizes.ours === undefined
      ? "refs same"
      : { agree: "same", disagree: "DIFFERS", unchecked: "–" }[r.agreement.status];
  const rows = results.map((r) => [
    r.name,
    r.order,
    timeCell(r.tools.ours, repeat, timeout),
    timeCell(r.tools.sympy, repeat, timeout),
    timeCell(r.tools.singular, repeat, timeout),
    formatRatio(r.ratios.sympy),
    formatRatio(r.ratios.singular),
    sizes(r),
    check(r),
  ]);
  const headers = ["system", "order", "ours", "SymPy", "Singular", "ours/SymPy", "ours/Singular", "basis", "bases"];
  return renderTable(headers, rows, [false, false, true, true, true, true, true, true, false]);
}

const megabytes = (t: ToolSummary | undefined): string =>
  t?.status === "ok" && t.maxRssKb !== undefined ? `${formatNumber(t.maxRssKb / 1024)} MB` : "–";

/** No bound from a timeout here: the timeout limits wall time, not the CPU time a killed run had used. */
function cpuRatio(ours: ToolSummary, reference: ToolSummary, timeout: number): string {
  return ours.status === "ok" && reference.status === "ok" ? formatRatio(ratioOf(ours, reference, timeout)) : "–";
}

export function cpuTable(results: readonly SystemResult[], timeout: number): string {
  const cpu = (r: SystemResult, id: ToolId) => cpuView(r.tools[id] ?? NA);
  const rows = results.map((r) => [
    r.name,
    formatTiming(cpu(r, "ours"), timeout),
    formatTiming(cpu(r, "sympy"), timeout),
    formatTiming(cpu(r, "singular"), timeout),
    cpuRatio(cpu(r, "ours"), cpu(r, "sympy"), timeout),
    cpuRatio(cpu(r, "ours"), cpu(r, "singular"), timeout),
    megabytes(r.tools.ours),
    megabytes(r.tools.sympy),
    megabytes(r.tools.singular),
  ]);
  const headers = ["system", "ours cpu", "SymPy cpu", "Singular cpu", "ours/SymPy", "ours/Singular", "ours mem", "SymPy mem", "Singular mem"];
  return renderTable(headers, rows, [false, true, true, true, true, true, true, true, true]);
}
