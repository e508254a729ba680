/**
 * Reaction networks: our CSV file format (read and write) and exact structural analysis.
 *
 * - parseNetworkCsv(text) → Network, or a NetworkFileError listing every located problem.
 * - formatNetworkCsv(network) → CSV text that parses back to the same network.
 * - analyseStructure(network) → NetworkStructure, plain JSON-friendly data (rationals as strings).
 * - Constant species (`# constant: A = 2, B`): network.constants, each reaction's `held` part;
 *   importers (e.g. SBML boundary species) fill `constants` and strip them from the complexes.
 * - Initial values (`# initial: X = 1`): network.initial, the default start of analyses.
 * - The exact pieces (complexes, Y, incidence and stoichiometric matrices, conservation laws) for
 *   the steady-state layer.
 *
 * Example:
 *   const net = parseNetworkCsv("reaction\nE + S <-> C\nC -> E + P\n");
 *   analyseStructure(net).deficiency; // 0
 */
export type { Complex } from "./complex";
export { SPECIES_NAME, makeComplex, formatComplex, sameComplex, compareNames } from "./complex";
export type { Arrow, ConstantSpecies, DirectedReaction, InitialValue, Network, NetworkRow } from "./model";
export { CONSTANT_DIRECTIVE, formatConstantDeclaration, readConstantDeclarations, splitComplex } from "./constant-species";
export { INITIAL_DIRECTIVE, formatInitialDeclaration, readInitialDeclarations, initialMapOf } from "./initial-values";
export { type NetworkFileProblem, NetworkFileError, formatProblem } from "./errors";
export { NETWORK_COLUMNS, type NetworkColumn, parseNetworkCsv, tryParseNetworkCsv } from "./parse-csv";
export { parseReactionText, type ParsedReaction, type ReactionTextResult } from "./reaction-text";
export { defaultRateName } from "./rate-names";
export { formatNetworkCsv } from "./format-csv";
export {
  complexesOf,
  complexIndex,
  complexCompositionMatrix,
  incidenceMatrix,
  stoichiometricMatrix,
} from "./matrices";
export { type ConservationAnalysis, type ConservationOptions, analyseConservation } from "./conservation";
export { type DirectedGraph, connectedComponents, stronglyConnectedComponents, terminalComponents } from "./graph";
export { type TheoremVerdict, deficiencyZeroVerdict, deficiencyOneVerdict } from "./deficiency-theorems";
export { type NetworkStructure, type ReactionSummary, analyseStructure } from "./structure";
export { type StructuralCapabilities, type StructuralCount, type StructurallyRobust, structuralCapabilities, shinarFeinbergRobust } from "./capabilities";
export { parseReactionList, formatReactionList } from "./reaction-list";
export { NETWORK_FORMATS, type NetworkFormat, type NetworkDocument, formatFromName, sniffFormat, readNetworkDocument } from "./formats";
export { decodeNetworkFile, textFileProblem, type DecodedFile } from "./text-file";
export { NETWORK_LIMITS, networkLimitProblems, rateValueWithinLimits } from "./limits";
