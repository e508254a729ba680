/**
 * The issue-4 benchmark target (`npm run bench -- --analyse`): our `analyse` of the two-site
 * distributive phosphorylation cycle with all twelve rate constants symbolic must produce a
 * correct parametrisation (checked independently, parametrisation-check.ts), timed whole process
 * against Singular's brute-force block-order `std` of the same steady-state system
 * (bench/systems/phospho-2site-symbolic.txt, `(lp(9),dp(15))`), side by side.
 *
 * Example row: `ours analyse --json   4.1 s   parametrisation checked at 3 points`.
 */
import { join } from "node:path";
import type { BenchNetwork } from "./systems";
import type { SystemFile } from "./system-file";
import { checkParametrisation, type CheckResult } from "./parametrisation-check";
import { runProcess, type ProcessRun } from "./process";
import { median } from "./stats";
import { formatNumber, renderTable } from "./table";
import type { Invocation, Tool } from "./tools";

export interface TargetRow {
  readonly program: string;
  readonly command: string;
  /** Wall seconds of each completed run; empty when the first run timed out or failed. */
  readonly runs: number[];
  readonly cpuRuns: number[];
  readonly timedOut: boolean;
  readonly outcome: string;
  readonly ok: boolean;
}

/** What one run of ours printed: a checked parametrisation, or why not. */
export function judgeAnalyse(run: ProcessRun, network: BenchNetwork): CheckResult {
  if (run.timedOut) return { ok: false, reason: "timed out" };
  if (run.exitCode !== 0) return { ok: false, reason: `exit code ${run.exitCode}: ${run.stderr.trim().split("\n")[0] ?? ""}` };
  let json: { parametrisation?: unknown };
  try {
    json = JSON.parse(run.stdout) as { parametrisation?: unknown };
  } catch {
    return { ok: false, reason: "the output is not JSON" };
  }
  return checkParametrisation(json.parametrisation as never, network.reactions, network.species, network.rates);
}

/** What Singular printed: the size of its basis (lines of the ideal), or why it stopped. */
export function judgeSingular(run: ProcessRun): CheckResult | { ok: true; basisSize: number } {
  if (run.timedOut) return { ok: false, reason: "timed out" };
  if (run.exitCode !== 0) return { ok: false, reason: `exit code ${run.exitCode}` };
  const lines = run.stdout.split("\n").filter((l) => l.trim() !== "");
  return { ok: true, basisSize: lines.length };
}

async function timeRuns(
  repeat: number,
  timeout: number,
  root: string,
  scratch: string,
  invoke: () => { command: string; args: readonly string[] },
  judge: (r: ProcessRun) => { ok: boolean; reason?: string; points?: number; basisSize?: number },
): Promise<Omit<TargetRow, "program" | "command">> {
  const runs: number[] = [];
  const cpuRuns: number[] = [];
  let outcome = "";
  for (let i = 0; i < repeat; i++) {
    const { command, args } = invoke();
    const r = await runProcess(command, args, timeout, root, join(scratch, "time.txt"));
    const verdict = judge(r);
    if (!verdict.ok) return { runs, cpuRuns, timedOut: r.timedOut, outcome: verdict.reason ?? "failed", ok: false };
    runs.push(r.seconds);
    if (r.cpuSeconds !== undefined) cpuRuns.push(r.cpuSeconds);
    outcome = verdict.points !== undefined ? `parametrisation checked at ${verdict.points} random points` : `reduced basis, ${verdict.basisSize} lines`;
    if (r.seconds > 30) break; // a long run is not repeated
  }
  return { runs, cpuRuns, timedOut: false, outcome, ok: true };
}

/** Runs ours (`repeat` times) and Singular (once unless it is quick), each under `timeout` seconds. */
export async function measureAnalyseTarget(
  network: BenchNetwork,
  system: SystemFile,
  ours: Invocation | undefined,
  singular: Tool,
  repeat: number,
  timeout: number,
  root: string,
  scratch: string,
): Promise<TargetRow[]> {
  const csv = `bench/systems/${network.name}.csv`;
  const txt = `bench/systems/${network.name}.txt`;
  const rows: TargetRow[] = [];
  if (ours) {
    const oursInvoke = () => ({ command: ours.command, args: [...ours.args, "analyse", csv, "--json"] });
    // One untimed run: builds the CLI bundle when domain/ changed.
    const { command, args } = oursInvoke();
    await runProcess(command, args, timeout, root);
    const r = await timeRuns(repeat, timeout, root, scratch, oursInvoke, (run) => judgeAnalyse(run, network));
    rows.push({ program: "ours", command: `analyse ${csv} --json (parametrisation, linear elimination first)`, ...r });
  }
  if (!singular.unavailable) {
    const r = await timeRuns(repeat, timeout, root, scratch, () => singular.invocation(txt, system, scratch), judgeSingular);
    rows.push({ program: "Singular", command: `std in (lp(9),dp(15)) of ${txt} (brute force)`, ...r });
  }
  return rows;
}

export function targetTable(rows: readonly TargetRow[], timeout: number): string {
  const cell = (r: TargetRow, values: number[]) =>
    r.timedOut ? `>${timeout} s` : values.length === 0 ? "–" : `${formatNumber(median(values))} s${values.length > 1 ? "" : " (1×)"}`;
  return renderTable(
    ["program", "computation", "wall (median)", "cpu", "result"],
    rows.map((r) => [r.program, r.command, cell(r, r.runs), r.cpuRuns.length === r.runs.length ? cell(r, r.cpuRuns) : "–", r.ok ? r.outcome : `FAILED: ${r.outcome}`]),
    [false, false, true, true, false],
  );
}
