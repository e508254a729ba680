/**
 * Bad input reported by the domain, in the command line's words: a problem with an input is
 * named by the option that gave it (`--initial: 'Z' is not a species …`). The domain's messages
 * name no option (the web shows them too); the typed reason is worded here.
 */
import { AlgebraError } from "../algebra/index";
import { NetworkFileError } from "../network/index";
import { inputProblemText, SteadyStateInputError } from "../steady-state/index";
import { CliError } from "./io";

/** The CliError for an input problem the domain threw, or null for anything else (a bug, to rethrow). */
export function cliInputError(e: unknown): CliError | null {
  if (e instanceof SteadyStateInputError) return new CliError(inputProblemText(e.problem, (input) => `--${input}`));
  if (e instanceof NetworkFileError || e instanceof AlgebraError) return new CliError(e.message);
  return null;
}
