import { formatRational } from "../algebra/rational";
import { rank } from "../linear/rref";
import { createMatrix } from "../linear/matrix";
import { formatComplex } from "./complex";
import { analyseConservation, type ConservationOptions } from "./conservation";
import { deficiencyOneVerdict, deficiencyZeroVerdict, type TheoremVerdict } from "./deficiency-theorems";
import { connectedComponents, stronglyConnectedComponents, terminalComponents, type DirectedGraph } from "./graph";
import {
  complexCompositionMatrix,
  complexIndex,
  complexesOf,
  incidenceMatrix,
  stoichiometricMatrix,
  toIntegerRows,
} from "./matrices";
import type { Network } from "./model";

/** One directed reaction in plain data. */
export interface ReactionSummary {
  readonly id: string;
  readonly label?: string;
  /** Canonical complex texts, e.g. `E + S`. */
  readonly reactant: string;
  readonly product: string;
  readonly rate: string;
  /** Exact value as text (`1/2`), when given. */
  readonly rateValue?: string;
  readonly row: number;
  /** Constant species of the reactant with their coefficients; their concentrations multiply the rate. */
  readonly held?: Record<string, number>;
}

/** Plain-data, JSON-friendly structural analysis of a network; keys follow the CLI contract. */
export interface NetworkStructure {
  /** Species that are variables (constant species are not among them). */
  readonly species: string[];
  /** Species held constant, in declaration order: value as exact text, or absent when symbolic. */
  readonly constants: { readonly name: string; readonly value?: string }[];
  /** Initial concentrations stored with the version (`# initial:`), exact text; absent when none. */
  readonly initial?: { readonly name: string; readonly value: string }[];
  /** Canonical texts, order of first appearance. */
  readonly complexes: string[];
  /** Number of directed reactions. */
  readonly reactions: number;
  readonly reactionList: ReactionSummary[];
  /** Y: species × complexes. */
  readonly complexComposition: number[][];
  /** Complexes × reactions, −1 at the reactant, +1 at the product. */
  readonly incidenceMatrix: number[][];
  /** N = Y·I: species × reactions. */
  readonly stoichiometricMatrix: number[][];
  /** s = rank N. */
  readonly rank: number;
  /** ℓ, the number of linkage classes. */
  readonly linkageClasses: number;
  readonly linkageClassMembers: string[][];
  readonly strongLinkageClasses: string[][];
  readonly terminalStrongLinkageClasses: string[][];
  /** Every reaction has its reverse. */
  readonly reversible: boolean;
  readonly weaklyReversible: boolean;
  /** δ = n − ℓ − s. */
  readonly deficiency: number;
  /** δᵢ = nᵢ − 1 − sᵢ for each linkage class. */
  readonly linkageClassDeficiencies: number[];
  /** Basis of conservation laws, each species → integer coefficient (non-zero entries only). */
  readonly conservationLaws: Record<string, number>[];
  /** Extreme rays of the non-negative left kernel; null if the size budget was exceeded. */
  readonly minimalSemiPositiveConservationLaws: Record<string, number>[] | null;
  /** A strictly positive conservation law exists; null if unknown. */
  readonly conservative: boolean | null;
  readonly deficiencyZeroTheorem: TheoremVerdict;
  readonly deficiencyOneTheorem: TheoremVerdict;
  readonly warnings: string[];
}

/**
 * Structural analysis of a reaction network, all exact: complexes, Y, incidence and
 * stoichiometric matrices, rank s, linkage classes ℓ, strong and terminal strong linkage
 * classes, weak reversibility, deficiency δ = n − ℓ − s, conservation laws, and the verdicts of
 * the deficiency zero and one theorems (Feinberg, Chem. Eng. Sci. 42 (1987); Horn & Jackson,
 * Arch. Rational Mech. Anal. 47 (1972); Feinberg, Arch. Rational Mech. Anal. 132 (1995)).
 *
 * Example: for E + S <-> C -> E + P: 4 species, complexes [E + S, C, E + P], 3 reactions,
 * rank 2, 1 linkage class, deficiency 3 − 1 − 2 = 0, not weakly reversible, conservation
 * laws E + C and S + C + P, so no positive steady state exists.
 */
export function analyseStructure(network: Network, options: ConservationOptions = {}): NetworkStructure {
  const complexes = complexesOf(network);
  const names = complexes.map((c) => formatComplex(c));
  const index = complexIndex(complexes);
  const y = complexCompositionMatrix(network.species, complexes);
  const inc = incidenceMatrix(network, complexes);
  const n = stoichiometricMatrix(network);
  const s = rank(n);

  const graph: DirectedGraph = {
    vertices: complexes.length,
    edges: network.reactions.map((r) => [index.get(formatComplex(r.reactant))!, index.get(formatComplex(r.product))!] as const),
  };
  const linkage = connectedComponents(graph);
  const strong = stronglyConnectedComponents(graph);
  const terminal = terminalComponents(graph, strong);
  const sccOf = new Array<number>(complexes.length);
  strong.forEach((c, k) => c.forEach((v) => (sccOf[v] = k)));
  const weaklyReversible = graph.edges.every(([a, b]) => sccOf[a] === sccOf[b]);
  const edgeKeys = new Set(graph.edges.map(([a, b]) => `${a}>${b}`));
  const reversible = graph.edges.every(([a, b]) => edgeKeys.has(`${b}>${a}`));
  const deficiency = complexes.length - linkage.length - s;

  const linkageOf = new Array<number>(complexes.length);
  linkage.forEach((c, k) => c.forEach((v) => (linkageOf[v] = k)));
  const linkageClassDeficiencies = linkage.map((members, k) => {
    const cols = network.reactions.map((_, j) => j).filter((j) => linkageOf[graph.edges[j][0]] === k);
    const sub = createMatrix(n.rows, cols.length, (i, c) => n.entries[i][cols[c]]);
    return members.length - 1 - rank(sub);
  });
  const terminalPerLinkageClass = linkage.map((_, k) => terminal.filter((t) => linkageOf[t[0]] === k).length);

  const conservation = analyseConservation(n, options);
  const asLaw = (v: readonly bigint[]): Record<string, number> => {
    const law: Record<string, number> = {};
    v.forEach((x, i) => {
      if (x !== 0n) law[network.species[i]] = Number(x);
    });
    return law;
  };
  const warnings = [...conservation.warnings];
  const allLaws = [...conservation.basis, ...(conservation.minimalSemiPositive ?? [])];
  if (allLaws.some((v) => v.some((x) => !Number.isSafeInteger(Number(x))))) {
    warnings.push("Some conservation-law coefficients exceed 2^53 and are rounded in this output.");
  }

  return {
    species: [...network.species],
    constants: (network.constants ?? []).map((c) => ({ name: c.name, ...(c.value ? { value: formatRational(c.value) } : {}) })),
    ...(network.initial && network.initial.length > 0 ? { initial: network.initial.map((i) => ({ name: i.name, value: formatRational(i.value) })) } : {}),
    complexes: names,
    reactions: network.reactions.length,
    reactionList: network.reactions.map((r) => ({
      id: r.id,
      ...(r.label !== undefined ? { label: r.label } : {}),
      reactant: formatComplex(r.reactant),
      product: formatComplex(r.product),
      rate: r.rate,
      ...(r.rateValue !== undefined ? { rateValue: formatRational(r.rateValue) } : {}),
      row: r.row,
      ...(r.held ? { held: { ...r.held } } : {}),
    })),
    complexComposition: toIntegerRows(y),
    incidenceMatrix: toIntegerRows(inc),
    stoichiometricMatrix: toIntegerRows(n),
    rank: s,
    linkageClasses: linkage.length,
    linkageClassMembers: linkage.map((c) => c.map((v) => names[v])),
    strongLinkageClasses: strong.map((c) => c.map((v) => names[v])),
    terminalStrongLinkageClasses: terminal.map((c) => c.map((v) => names[v])),
    reversible,
    weaklyReversible,
    deficiency,
    linkageClassDeficiencies,
    conservationLaws: conservation.basis.map(asLaw),
    minimalSemiPositiveConservationLaws: conservation.minimalSemiPositive?.map(asLaw) ?? null,
    conservative: conservation.conservative,
    deficiencyZeroTheorem: deficiencyZeroVerdict(deficiency, weaklyReversible),
    deficiencyOneTheorem: deficiencyOneVerdict({ deficiency, linkageClassDeficiencies, terminalPerLinkageClass, weaklyReversible }),
    warnings,
  };
}
