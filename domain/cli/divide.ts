import { divide } from "../algebra/division";
import { AlgebraError } from "../algebra/errors";
import type { CliIO, CommandModule } from "./io";
import { CliError, parseArgs, readInput } from "./io";
import { fieldFromFlag, parseSystemFile } from "./system-file";

/**
 * `divide FILE [--field p]`: the first polynomial is the dividend, the rest are the ordered
 * divisors; prints `q1 = …`, …, `qN = …`, `r = …`.
 */
export function run(args: readonly string[], io: CliIO): number {
  const { positionals, flags } = parseArgs(args, ["field"]);
  if (positionals.length !== 1) throw new CliError("usage: divide FILE [--field p]");
  const field = fieldFromFlag(flags.get("field"));
  const { polys, ring, lines } = parseSystemFile(readInput(io, positionals[0]), field);
  if (polys.length < 2) throw new CliError("divide needs a dividend and at least one divisor (one polynomial per line)");
  const zero = polys.findIndex((p, i) => i > 0 && p.coeffs.length === 0);
  if (zero >= 0) throw new CliError(`division by the zero polynomial at line ${lines[zero]}, column 1`);
  try {
    const { quotients, remainder } = divide(polys[0], polys.slice(1));
    const out = quotients.map((q, i) => `q${i + 1} = ${ring.format(q)}`);
    out.push(`r = ${ring.format(remainder)}`);
    io.stdout(out.join("\n") + "\n");
  } catch (e) {
    if (e instanceof AlgebraError) throw new CliError(e.message);
    throw e;
  }
  return 0;
}

export const command: CommandModule = { run, summary: "divide FILE [--field p]     q1 = …, …, r = … (first line ÷ the others, in order)" };
