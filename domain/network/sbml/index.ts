/**
 * SBML (the Systems Biology Markup Language, an open standard) in and out.
 *
 * - readSbml(text) → SbmlImport: the network when every reaction is mass action, else every
 *   refused element with its line and id, and each reaction's fate.
 * - formatSbml(network, { initial }) → SBML Level 3 Version 2 Core text.
 *
 * Example: readSbml(formatSbml(parseNetworkCsv("reaction\nA <-> B\n"))).network has the same reactions.
 */
export { readSbml, type SbmlImport, type SbmlProblem, type SbmlReactionReport } from "./read-sbml";
export { formatSbml, type SbmlWriteOptions } from "./write-sbml";
export { exactDecimal } from "./mathml";
