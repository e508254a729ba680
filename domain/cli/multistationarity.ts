import { parseNetworkCsv } from "../network/index";
import { multistationarity, type MultistationarityResult } from "../steady-state/multistationarity";
import { multistationarityJson } from "../steady-state/result";
import type { CliIO, CommandModule } from "./io";
import { cliInputError } from "./input-errors";
import { CliError, parseArgs, readInput } from "./io";

const USAGE = "usage: multistationarity NETWORK.csv [--timeout SECONDS] [--json]";

function report(r: MultistationarityResult): string {
  const lines = [`Verdict: ${r.verdict} (${r.method})`, r.reason];
  if (r.witness) {
    lines.push("", "Witness:");
    lines.push(`  rate constants: ${Object.entries(r.witness.rates).map(([k, v]) => `${k}=${v}`).join(", ")}`);
    if (Object.keys(r.witness.totals).length > 0) lines.push(`  totals: ${Object.entries(r.witness.totals).map(([k, v]) => `${k}=${v}`).join(", ")}`);
    lines.push(`  initial state with these totals: ${Object.entries(r.witness.initial).map(([k, v]) => `${k}=${v}`).join(",")}`);
    r.witness.steadyStates.forEach((s, i) => lines.push(`  steady state #${i + 1}: ${Object.entries(s).map(([k, v]) => `${k}=${v.toPrecision(10)}`).join(", ")}`));
  }
  lines.push("", "Assumes:", ...r.assumptions.map((a) => `  - ${a}`), "", "Sources:", ...r.sources.map((s) => `  - ${s}`));
  return lines.join("\n") + "\n";
}

/** `multistationarity NETWORK.csv [--json]`: can some positive rate constants give ≥ 2 positive steady states in one class? */
export function run(args: readonly string[], io: CliIO): number {
  const json = args.includes("--json");
  const { positionals, flags } = parseArgs(args.filter((a) => a !== "--json"), ["timeout"]);
  if (positionals.length !== 1) throw new CliError(USAGE);
  const timeout = flags.has("timeout") ? Number(flags.get("timeout")) : 60;
  if (!(timeout > 0)) throw new CliError("--timeout expects a positive number of seconds");
  let result: MultistationarityResult;
  try {
    result = multistationarity(parseNetworkCsv(readInput(io, positionals[0])), { timeoutMs: timeout * 1000 });
  } catch (e) {
    throw cliInputError(e) ?? e;
  }
  io.stdout(json ? JSON.stringify(multistationarityJson(result), null, 2) + "\n" : report(result));
  return 0;
}

export const command: CommandModule = {
  run,
  summary: "multistationarity NETWORK.csv [--json]   can some rate constants give two positive steady states in one class?",
};
