/**
 * Bad input the domain reports (a species that is not in the network, a scan range the wrong way
 * round), worded for the web pages: inputs are named by their form fields, never by command-line
 * options. The domain throws a typed SteadyStateInputError; this is the web's wording of it.
 */
import { inputProblemText, SteadyStateInputError, type InputName } from "@domain/steady-state/index";

/** The form fields on the new-analysis and scan forms. */
const FIELD_NAMES: Record<InputName, string> = {
  order: "Elimination order",
  initial: "Initial concentrations",
  from: "From",
  to: "To",
  vary: "Vary",
};

/** The message a page shows for an error of a job: input problems in the form's words, others as they are. */
export function jobErrorText(e: unknown): string {
  if (e instanceof SteadyStateInputError) return inputProblemText(e.problem, (input) => `${FIELD_NAMES[input]}`);
  return e instanceof Error ? e.message : String(e);
}
