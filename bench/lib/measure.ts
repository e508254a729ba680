/**
 * Measures one system: every program `repeat` times, interleaved (rounds of one run each,
 * rotating who goes first), stopping a program early after a timeout, an error, or a run
 * longer than `long` seconds; then checks the printed bases agree.
 */
import { join } from "node:path";
import { checkAgreement, type Agreement } from "./agreement";
import type { BenchOptions } from "./options";
import { runProcess } from "./process";
import { median } from "./stats";
import { monomialOrderOf, type SystemFile } from "./system-file";
import { ratioOf, type Ratio, type ToolSummary } from "./table";
import type { Tool, ToolId } from "./tools";

export interface SystemResult {
  readonly name: string;
  readonly order: string;
  readonly vars: number;
  readonly equations: number;
  readonly tools: Partial<Record<ToolId, ToolSummary>>;
  readonly ratios: { readonly sympy: Ratio; readonly singular: Ratio };
  readonly agreement: Agreement;
}

interface ToolState {
  runs: number[];
  cpuRuns: number[];
  maxRssKb?: number;
  stopped?: ToolSummary;
  output?: string[];
}

function summarise(st: ToolState): ToolSummary {
  if (st.stopped) return st.stopped;
  const cpuComplete = st.cpuRuns.length === st.runs.length && st.runs.length > 0;
  return {
    status: "ok",
    median: median(st.runs),
    runs: st.runs,
    ...(cpuComplete ? { cpuRuns: st.cpuRuns, cpuMedian: median(st.cpuRuns) } : {}),
    ...(st.maxRssKb !== undefined ? { maxRssKb: st.maxRssKb } : {}),
  };
}

export async function measureSystem(
  name: string,
  system: SystemFile,
  index: number,
  tools: readonly Tool[],
  o: BenchOptions,
  root: string,
  scratch: string,
): Promise<SystemResult> {
  const relPath = `bench/systems/${name}.txt`;
  const states = new Map<ToolId, ToolState>(tools.map((t) => [t.id, { runs: [], cpuRuns: [] }]));
  for (const t of tools) if (t.unavailable) states.get(t.id)!.stopped = { status: "n/a", reason: t.unavailable };
  for (let round = 0; round < o.repeat; round++) {
    // Rotate who goes first so no program always runs right after the same other one.
    const shift = (round + index) % tools.length;
    for (const t of [...tools.slice(shift), ...tools.slice(0, shift)]) {
      const st = states.get(t.id)!;
      if (st.stopped) continue;
      const inv = t.invocation(relPath, system, scratch, o.prime);
      const run = await runProcess(inv.command, inv.args, o.timeout, root, join(scratch, `${t.id}.time`));
      if (run.timedOut) st.stopped = { status: "timeout" };
      else if (run.exitCode !== 0 && run.exitCode === t.unsupportedExitCode) st.stopped = { status: "n/a", reason: run.stderr.trim() };
      else if (run.exitCode !== 0) {
        // A failure after earlier successes still counts as a failure of the program.
        st.stopped = { status: "error", message: run.stderr.trim().split("\n").slice(-3).join(" / ") || `exit code ${run.exitCode}` };
      } else {
        st.runs.push(run.seconds);
        if (run.cpuSeconds !== undefined) st.cpuRuns.push(run.cpuSeconds);
        if (run.maxRssKb !== undefined) st.maxRssKb = Math.max(st.maxRssKb ?? 0, run.maxRssKb);
        st.output ??= run.stdout.split("\n");
        if (run.seconds > o.long) st.stopped = summarise(st);
      }
    }
  }
  const summaries: Partial<Record<ToolId, ToolSummary>> = {};
  const outputs: Partial<Record<ToolId, string[]>> = {};
  for (const t of tools) {
    const st = states.get(t.id)!;
    summaries[t.id] = summarise(st);
    if (st.output) outputs[t.id] = st.output;
  }
  const na: ToolSummary = { status: "n/a", reason: "not run" };
  const ours = summaries.ours ?? na;
  return {
    name,
    order: system.order,
    vars: system.vars.length,
    equations: system.polys.length,
    tools: summaries,
    ratios: { sympy: ratioOf(ours, summaries.sympy ?? na, o.timeout), singular: ratioOf(ours, summaries.singular ?? na, o.timeout) },
    agreement: checkAgreement(outputs, system.vars, monomialOrderOf(system), o.prime),
  };
}
