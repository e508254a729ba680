/** A theorem's verdict on a network, with its hypotheses spelled out beside it. */
export interface TheoremVerdict {
  /** Whether the theorem's structural hypotheses hold for this network. */
  readonly applies: boolean;
  /** Plain-text conclusions, empty when the theorem does not apply. */
  readonly conclusions: string[];
  /** Assumptions under which the conclusions hold (kinetics, rate constants, concentrations). */
  readonly assumptions: string[];
  /** Why it applies or not, in one sentence. */
  readonly reason: string;
  /** Papers the statement follows. */
  readonly sources: string[];
}

const FEINBERG_1987 =
  "M. Feinberg, Chemical reaction network structure and the stability of complex isothermal reactors I. The deficiency zero and deficiency one theorems, Chem. Eng. Sci. 42 (1987) 2229–2268";
const HORN_JACKSON_1972 = "F. Horn and R. Jackson, General mass action kinetics, Arch. Rational Mech. Anal. 47 (1972) 81–116";
const FEINBERG_1995 =
  "M. Feinberg, The existence and uniqueness of steady states for a class of chemical reaction networks, Arch. Rational Mech. Anal. 132 (1995) 311–370";

const MASS_ACTION = "Mass-action kinetics.";
const POSITIVE_RATES = "Every rate constant is positive (any positive values; the verdict does not depend on them).";
const POSITIVE_STATES = "Statements concern positive states: every species concentration strictly positive.";
const CLASSES =
  "Steady states are counted within a positive stoichiometric compatibility class: the states reachable from a positive initial state, fixed by the conservation totals.";

/**
 * Verdict of the deficiency zero theorem (Feinberg 1987, Theorem 4.1 — recalled from memory;
 * Horn & Jackson 1972). For δ = 0: weakly reversible ⇒ for any positive rate constants each
 * positive stoichiometric compatibility class holds exactly one positive steady state, it is
 * complex balanced and locally asymptotically stable, and no sustained oscillation passes through
 * positive states; not weakly reversible ⇒ no positive steady state and no periodic orbit
 * through a positive state (for any kinetics).
 *
 * Example: A <-> B <-> C <-> A (δ = 0, weakly reversible) gets the first verdict; the
 * Michaelis–Menten mechanism E + S <-> C -> E + P (δ = 0, not weakly reversible) the second.
 */
export function deficiencyZeroVerdict(deficiency: number, weaklyReversible: boolean): TheoremVerdict {
  const sources = [FEINBERG_1987, HORN_JACKSON_1972];
  if (deficiency !== 0) {
    return {
      applies: false,
      conclusions: [],
      assumptions: [],
      reason: `The deficiency is ${deficiency}, not 0, so the deficiency zero theorem says nothing here (it neither affirms nor rules out several steady states or oscillations).`,
      sources,
    };
  }
  if (weaklyReversible) {
    return {
      applies: true,
      conclusions: [
        "Each positive stoichiometric compatibility class contains exactly one positive steady state.",
        "That steady state is complex balanced.",
        "It is locally asymptotically stable within its compatibility class.",
        "No sustained oscillation: there is no non-constant periodic trajectory through positive states.",
      ],
      assumptions: [MASS_ACTION, POSITIVE_RATES, POSITIVE_STATES, CLASSES],
      reason: "The deficiency is 0 and the network is weakly reversible.",
      sources,
    };
  }
  return {
    applies: true,
    conclusions: [
      "There is no positive steady state.",
      "There is no periodic trajectory through a positive state.",
    ],
    assumptions: [
      "Any kinetics in which a reaction runs exactly when all its reactant species are present (mass-action included).",
      POSITIVE_RATES,
      POSITIVE_STATES,
    ],
    reason: "The deficiency is 0 and the network is not weakly reversible.",
    sources,
  };
}

export interface DeficiencyOneInput {
  readonly deficiency: number;
  readonly linkageClassDeficiencies: readonly number[];
  /** Number of terminal strong linkage classes inside each linkage class. */
  readonly terminalPerLinkageClass: readonly number[];
  readonly weaklyReversible: boolean;
}

/**
 * Applicability of the deficiency one theorem (Feinberg 1995, Theorem 4.2 — recalled from
 * memory; also Feinberg 1987): each linkage class has deficiency δᵢ ≤ 1, Σδᵢ = δ, and each linkage
 * class holds exactly one terminal strong linkage class. Then, under mass action, no positive
 * compatibility class holds more than one positive steady state, whatever the rate constants; if
 * the network is also weakly reversible, each such class holds exactly one.
 *
 * Example: the Shinar–Feinberg ACR network (Science 2010) has δ = 1 but linkage-class
 * deficiencies 0, 0, 0, so the sum condition fails and the theorem does not apply.
 */
export function deficiencyOneVerdict(input: DeficiencyOneInput): TheoremVerdict {
  const sources = [FEINBERG_1995, FEINBERG_1987];
  const sum = input.linkageClassDeficiencies.reduce((a, b) => a + b, 0);
  const failures: string[] = [];
  if (input.linkageClassDeficiencies.some((d) => d > 1)) failures.push("some linkage class has deficiency above 1");
  if (sum !== input.deficiency) failures.push(`the linkage-class deficiencies sum to ${sum}, not to δ = ${input.deficiency}`);
  if (input.terminalPerLinkageClass.some((t) => t !== 1)) failures.push("some linkage class has more than one terminal strong linkage class");
  if (failures.length > 0) {
    return { applies: false, conclusions: [], assumptions: [], reason: `Hypotheses fail: ${failures.join("; ")}.`, sources };
  }
  const conclusions = ["No positive stoichiometric compatibility class contains more than one positive steady state."];
  if (input.weaklyReversible) conclusions.push("Since the network is weakly reversible, each positive compatibility class contains exactly one positive steady state.");
  return {
    applies: true,
    conclusions,
    assumptions: [MASS_ACTION, POSITIVE_RATES, POSITIVE_STATES, CLASSES],
    reason:
      input.deficiency === 0
        ? "Hypotheses hold (the deficiency is 0, so the deficiency zero theorem gives the sharper verdict)."
        : "Each linkage class has deficiency at most 1, they sum to the network's deficiency, and each linkage class has one terminal strong linkage class.",
    sources,
  };
}
