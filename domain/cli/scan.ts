import { parseRational, sign } from "../algebra/rational";
import { parseNetworkCsv } from "../network/index";
import { foldScan, type FoldScan } from "../steady-state/folds";
import { parseInitial } from "./analyse";
import type { CliIO, CommandModule } from "./io";
import { cliInputError } from "./input-errors";
import { CliError, parseArgs, readInput } from "./io";

const USAGE = "usage: scan NETWORK.csv --vary NAME --from A --to B [--initial S=1,E=0.1] [--points N] [--timeout SECONDS] [--json]";

/** The CLI contract's JSON object: parameter, folds, windows, points (plus kind, eliminant, assumptions, warnings). */
export function scanToJson(r: FoldScan): Record<string, unknown> {
  return {
    parameter: r.parameter,
    folds: r.folds.map((f) => ({ value: f.value, interval: f.interval })),
    windows: r.windows.map((w) => ({ from: w.from, to: w.to, count: w.count })),
    points: r.points.map((p) => ({ value: p.value, steadyStates: p.steadyStates.map((s) => ({ concentrations: s.concentrations, stable: s.stable })) })),
    kind: r.kind,
    eliminant: r.eliminant,
    assumptions: r.assumptions,
    warnings: r.warnings,
  };
}

function report(r: FoldScan): string {
  const lines = [`Scan of ${r.parameter} (${r.kind})`, `Eliminant in ${r.eliminant.variable}: ${r.eliminant.polynomial}`, "", "Fold points (count of positive steady states changes):"];
  if (r.folds.length === 0) lines.push("  none in the range");
  for (const f of r.folds) lines.push(`  ${r.parameter} = ${f.value.toPrecision(10)}   in [${f.interval[0]}, ${f.interval[1]}]`);
  lines.push("", "Windows:");
  for (const w of r.windows) lines.push(`  ${w.from.toPrecision(10)} < ${r.parameter} < ${w.to.toPrecision(10)}: ${w.count} positive steady state(s)`);
  lines.push("", `Assumes: ${r.assumptions}`);
  for (const w of r.warnings) lines.push(`Note: ${w}`);
  return lines.join("\n") + "\n";
}

/** `scan NETWORK.csv --vary NAME --from A --to B [--initial S=1] [--json]`: exact fold points and windows. */
export function run(args: readonly string[], io: CliIO): number {
  const json = args.includes("--json");
  const { positionals, flags } = parseArgs(args.filter((a) => a !== "--json"), ["vary", "from", "to", "initial", "points", "timeout"]);
  if (positionals.length !== 1 || !flags.has("vary") || !flags.has("from") || !flags.has("to")) throw new CliError(USAGE);
  const bound = (flag: string) => {
    const v = parseRational(flags.get(flag)!);
    if (!v || sign(v) < 0) throw new CliError(`--${flag}: expected a non-negative decimal or fraction, got '${flags.get(flag)}'`);
    return v;
  };
  const from = bound("from");
  const to = bound("to");
  const timeout = flags.has("timeout") ? Number(flags.get("timeout")) : 60;
  if (!(timeout > 0)) throw new CliError("--timeout expects a positive number of seconds");
  const points = flags.has("points") ? Number(flags.get("points")) : undefined;
  if (points !== undefined && !(Number.isInteger(points) && points >= 2 && points <= 2000)) throw new CliError("--points expects a whole number from 2 to 2000");
  const initial = flags.has("initial") ? parseInitial(flags.get("initial")!) : undefined;
  let result: FoldScan;
  try {
    const network = parseNetworkCsv(readInput(io, positionals[0]));
    result = foldScan(network, { parameter: flags.get("vary")!, from, to, initial, points, timeoutMs: timeout * 1000 });
  } catch (e) {
    throw cliInputError(e) ?? e;
  }
  io.stdout(json ? JSON.stringify(scanToJson(result), null, 2) + "\n" : report(result));
  return 0;
}

export const command: CommandModule = {
  run,
  summary: "scan NETWORK.csv --vary NAME --from A --to B [--initial S=1] [--json]   exact fold points and steady-state counts",
};
