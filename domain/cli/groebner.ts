import { AlgebraError } from "../algebra/errors";
import { groebnerBasis } from "../algebra/groebner";
import type { CliIO, CommandModule } from "./io";
import { CliError, parseArgs, readInput } from "./io";
import { fieldFromFlag, parseSystemFile } from "./system-file";

/**
 * Without `--timeout`, a computation stops after this many seconds with a clear error: an unlucky
 * input (a unit ideal reached the long way, say) must not run for ever. `--timeout` overrides it.
 */
export const DEFAULT_TIMEOUT_SECONDS = 60;

/**
 * `groebner FILE [--field p] [--timeout SECONDS]`: prints the reduced Gröbner basis, one monic
 * polynomial per line, sorted by increasing leading monomial (the zero ideal prints `0`). The
 * time limit defaults to DEFAULT_TIMEOUT_SECONDS.
 */
export function run(args: readonly string[], io: CliIO): number {
  const { positionals, flags } = parseArgs(args, ["field", "timeout"]);
  if (positionals.length !== 1) throw new CliError("usage: groebner FILE [--field p] [--timeout SECONDS]");
  const field = fieldFromFlag(flags.get("field"));
  const timeout = flags.has("timeout") ? Number(flags.get("timeout")) : DEFAULT_TIMEOUT_SECONDS;
  if (!(timeout > 0) || !Number.isFinite(timeout)) throw new CliError("--timeout expects a positive number of seconds");
  const { polys, ring } = parseSystemFile(readInput(io, positionals[0]), field);
  try {
    const basis = groebnerBasis(polys, { timeoutMs: timeout * 1000 });
    io.stdout(basis.length === 0 ? "0\n" : basis.map((g) => ring.format(g)).join("\n") + "\n");
  } catch (e) {
    if (e instanceof AlgebraError) throw new CliError(e.message);
    throw e;
  }
  return 0;
}

export const command: CommandModule = { run, summary: `groebner FILE [--field p] [--timeout SECONDS]   reduced Gröbner basis, one polynomial per line (time limit ${DEFAULT_TIMEOUT_SECONDS} s unless given)` };
