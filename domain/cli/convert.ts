import { formatNetworkCsv, formatReactionList, NETWORK_FORMATS } from "../network/index";
import { formatSbml } from "../network/sbml/index";
import type { CliIO, CommandModule } from "./io";
import { CliError, parseArgs } from "./io";
import { readNetworkFile } from "./network-input";

const USAGE = "usage: convert FILE --to csv|sbml|text [--from csv|sbml|text]";

/**
 * `convert FILE --to csv|sbml|text [--from …]`: reads our CSV, a reaction list or SBML (format from
 * `--from`, else the extension, else the content) and writes the other form on standard output.
 * Every form carries the constant species and initial values (CSV and text as `# constant:` and
 * `# initial:` lines, SBML as boundary species and initialConcentration); reading notes go to standard error.
 */
export function run(args: readonly string[], io: CliIO): number {
  const { positionals, flags } = parseArgs(args, ["to", "from"]);
  if (positionals.length !== 1 || !flags.has("to")) throw new CliError(USAGE);
  const to = flags.get("to")!;
  if (!(NETWORK_FORMATS as readonly string[]).includes(to)) throw new CliError(`--to expects one of ${NETWORK_FORMATS.join(", ")}, not '${to}'`);
  const doc = readNetworkFile(io, positionals[0], flags.get("from"));
  for (const n of doc.notes) io.stderr(`note: ${n}\n`);
  switch (to) {
    case "csv":
      io.stdout(formatNetworkCsv(doc.network));
      break;
    case "text":
      io.stdout(formatReactionList(doc.network));
      break;
    case "sbml": {
      const stem = positionals[0].replace(/^.*[\\/]/, "").replace(/\.[^.]*$/, "");
      io.stdout(formatSbml(doc.network, { id: stem === "-" ? "network" : stem, initial: doc.initial }));
      break;
    }
  }
  return 0;
}

export const command: CommandModule = {
  run,
  summary: "convert FILE --to csv|sbml|text [--from csv|sbml|text]   between our CSV, reaction lists and SBML",
};
